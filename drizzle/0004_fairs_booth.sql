CREATE TABLE `stock_adjustments` (
	`id` int AUTO_INCREMENT NOT NULL,
	`piece_id` int NOT NULL,
	`wood_id` int NOT NULL,
	`place` varchar(40) NOT NULL,
	`delta` int NOT NULL,
	`reason` varchar(160) NOT NULL,
	`user_id` varchar(36),
	`created_at` datetime NOT NULL,
	CONSTRAINT `stock_adjustments_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `kind` enum('sale','deposit') DEFAULT 'sale' NOT NULL;--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `order_id` int;--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `discount_minor` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `tendered_minor` int;--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `flagged` boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `booth_sales` ADD `received_at` datetime;--> statement-breakpoint
ALTER TABLE `fair_stock` ADD `returned` int;--> statement-breakpoint
ALTER TABLE `fairs` ADD `other_costs_minor` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `fairs` ADD `prices_include_tax` boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `fairs` ADD `card_fee_bp` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `fairs` ADD `helper_discount_bp` int DEFAULT 1000 NOT NULL;--> statement-breakpoint
ALTER TABLE `fairs` ADD `open_minutes` int DEFAULT 480 NOT NULL;--> statement-breakpoint
ALTER TABLE `fairs` ADD `closed_at` datetime;--> statement-breakpoint
ALTER TABLE `orders` ADD `deposit_minor` int;--> statement-breakpoint
ALTER TABLE `tallies` ADD `cash_paid_out_minor` int DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `stock_adjustments` ADD CONSTRAINT `stock_adjustments_piece_id_pieces_id_fk` FOREIGN KEY (`piece_id`) REFERENCES `pieces`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `stock_adjustments` ADD CONSTRAINT `stock_adjustments_wood_id_woods_id_fk` FOREIGN KEY (`wood_id`) REFERENCES `woods`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `stock_adjustments` ADD CONSTRAINT `stock_adjustments_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `stock_adjustments_piece` ON `stock_adjustments` (`piece_id`,`created_at`);--> statement-breakpoint
ALTER TABLE `booth_sales` ADD CONSTRAINT `booth_sales_order_id_orders_id_fk` FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON DELETE set null ON UPDATE no action;