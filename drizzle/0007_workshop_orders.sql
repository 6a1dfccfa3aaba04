CREATE TABLE `order_notes` (
	`id` int AUTO_INCREMENT NOT NULL,
	`order_id` int NOT NULL,
	`user_id` varchar(36),
	`body` varchar(2000) NOT NULL,
	`created_at` datetime NOT NULL,
	CONSTRAINT `order_notes_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `order_refunds` (
	`id` int AUTO_INCREMENT NOT NULL,
	`order_id` int NOT NULL,
	`provider_refund_id` varchar(255),
	`amount_minor` int NOT NULL,
	`reason` varchar(500) NOT NULL,
	`status` enum('pending','succeeded','failed','canceled') NOT NULL DEFAULT 'pending',
	`restocked` boolean NOT NULL DEFAULT false,
	`created_by` varchar(36),
	`created_at` datetime NOT NULL,
	CONSTRAINT `order_refunds_id` PRIMARY KEY(`id`),
	CONSTRAINT `order_refunds_provider` UNIQUE(`provider_refund_id`)
);
--> statement-breakpoint
ALTER TABLE `order_notes` ADD CONSTRAINT `order_notes_order_id_orders_id_fk` FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order_notes` ADD CONSTRAINT `order_notes_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order_refunds` ADD CONSTRAINT `order_refunds_order_id_orders_id_fk` FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order_refunds` ADD CONSTRAINT `order_refunds_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `order_notes_order` ON `order_notes` (`order_id`,`id`);--> statement-breakpoint
CREATE INDEX `order_refunds_order` ON `order_refunds` (`order_id`);