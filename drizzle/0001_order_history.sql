CREATE TABLE `order_history` (
	`id` int AUTO_INCREMENT NOT NULL,
	`order_id` int NOT NULL,
	`from_status` enum('pending','paid','carving','finishing','packed','shipped','cancelled','refunded','piece_gone') NOT NULL,
	`to_status` enum('pending','paid','carving','finishing','packed','shipped','cancelled','refunded','piece_gone') NOT NULL,
	`user_id` varchar(36),
	`reason` varchar(500) NOT NULL,
	`created_at` datetime NOT NULL,
	CONSTRAINT `order_history_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `orders` MODIFY COLUMN `status` enum('pending','paid','carving','finishing','packed','shipped','cancelled','refunded','piece_gone') NOT NULL DEFAULT 'pending';--> statement-breakpoint
ALTER TABLE `order_history` ADD CONSTRAINT `order_history_order_id_orders_id_fk` FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order_history` ADD CONSTRAINT `order_history_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `order_history_order` ON `order_history` (`order_id`,`id`);