CREATE TABLE `booth_discards` (
	`id` varchar(36) NOT NULL,
	`fair_id` int NOT NULL,
	`kind` enum('sale','deposit') NOT NULL,
	`summary` varchar(500) NOT NULL,
	`reason` varchar(500) NOT NULL,
	`discarded_by` varchar(36),
	`discarded_at` datetime NOT NULL,
	CONSTRAINT `booth_discards_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `order_history` MODIFY COLUMN `from_status` enum('pending','paid','carving','finishing','packed','shipped','cancelled','refunded','piece_gone','deposit_held') NOT NULL;--> statement-breakpoint
ALTER TABLE `order_history` MODIFY COLUMN `to_status` enum('pending','paid','carving','finishing','packed','shipped','cancelled','refunded','piece_gone','deposit_held') NOT NULL;--> statement-breakpoint
ALTER TABLE `orders` MODIFY COLUMN `status` enum('pending','paid','carving','finishing','packed','shipped','cancelled','refunded','piece_gone','deposit_held') NOT NULL DEFAULT 'pending';--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `late` boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `content_hash` varchar(64);--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `card_part_minor` int;--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `receipt_email` varchar(255);--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `voided_at` datetime;--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `voided_by` varchar(36);--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `void_reason` varchar(300);--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `void_id` varchar(36);--> statement-breakpoint
ALTER TABLE `orders` ADD `delivery` enum('post','collect');--> statement-breakpoint
ALTER TABLE `booth_sales` ADD CONSTRAINT `booth_sales_void_id_unique` UNIQUE(`void_id`);--> statement-breakpoint
ALTER TABLE `booth_discards` ADD CONSTRAINT `booth_discards_fair_id_fairs_id_fk` FOREIGN KEY (`fair_id`) REFERENCES `fairs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `booth_discards` ADD CONSTRAINT `booth_discards_discarded_by_users_id_fk` FOREIGN KEY (`discarded_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `booth_sales` ADD CONSTRAINT `booth_sales_voided_by_users_id_fk` FOREIGN KEY (`voided_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;