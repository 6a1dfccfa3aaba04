CREATE TABLE `booth_sales` (
	`id` varchar(36) NOT NULL,
	`fair_id` int NOT NULL,
	`method` enum('cash','card','other') NOT NULL,
	`lines` json NOT NULL,
	`subtotal_minor` int NOT NULL,
	`tax_minor` int NOT NULL DEFAULT 0,
	`total_minor` int NOT NULL,
	`sold_at` datetime NOT NULL,
	`recorded_by` varchar(36),
	CONSTRAINT `booth_sales_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `cart_lines` (
	`id` int AUTO_INCREMENT NOT NULL,
	`cart_id` varchar(36) NOT NULL,
	`piece_id` int NOT NULL,
	`wood_id` int NOT NULL,
	`quantity` int NOT NULL DEFAULT 1,
	`personalisation` json,
	`created_at` datetime NOT NULL,
	CONSTRAINT `cart_lines_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `carts` (
	`id` varchar(36) NOT NULL,
	`user_id` varchar(36),
	`destination` varchar(2),
	`created_at` datetime NOT NULL,
	`updated_at` datetime NOT NULL,
	CONSTRAINT `carts_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `fair_stock` (
	`id` int AUTO_INCREMENT NOT NULL,
	`fair_id` int NOT NULL,
	`piece_id` int NOT NULL,
	`wood_id` int NOT NULL,
	`loaded_out` int NOT NULL DEFAULT 0,
	`counted_back` int,
	CONSTRAINT `fair_stock_id` PRIMARY KEY(`id`),
	CONSTRAINT `fair_stock_line` UNIQUE(`fair_id`,`piece_id`,`wood_id`)
);
--> statement-breakpoint
CREATE TABLE `fairs` (
	`id` int AUTO_INCREMENT NOT NULL,
	`name` varchar(120) NOT NULL,
	`place` varchar(160) NOT NULL,
	`starts_on` date NOT NULL,
	`ends_on` date NOT NULL,
	`currency` varchar(3) NOT NULL DEFAULT 'USD',
	`booth_fee_minor` int NOT NULL DEFAULT 0,
	`sales_tax_bp` int NOT NULL DEFAULT 0,
	`cash_float_minor` int NOT NULL DEFAULT 0,
	`notes` text,
	CONSTRAINT `fairs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `order_lines` (
	`id` int AUTO_INCREMENT NOT NULL,
	`order_id` int NOT NULL,
	`piece_id` int NOT NULL,
	`wood_id` int NOT NULL,
	`title` varchar(120) NOT NULL,
	`wood_name` varchar(80) NOT NULL,
	`quantity` int NOT NULL,
	`unit_price_minor` int NOT NULL,
	`line_total_minor` int NOT NULL,
	`from_stock` boolean NOT NULL DEFAULT false,
	`personalisation` json,
	CONSTRAINT `order_lines_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `orders` (
	`id` int AUTO_INCREMENT NOT NULL,
	`ref` varchar(16) NOT NULL,
	`user_id` varchar(36),
	`cart_id` varchar(36),
	`email` varchar(255) NOT NULL,
	`buyer_name` varchar(120) NOT NULL,
	`address` json NOT NULL,
	`gift_note` varchar(500),
	`currency` varchar(3) NOT NULL,
	`subtotal_minor` int NOT NULL,
	`shipping_minor` int NOT NULL,
	`tax_minor` int NOT NULL DEFAULT 0,
	`total_minor` int NOT NULL,
	`status` enum('pending','paid','carving','finishing','packed','shipped','cancelled','refunded') NOT NULL DEFAULT 'pending',
	`checkout_session_id` varchar(255),
	`payment_intent_id` varchar(255),
	`refunded_minor` int NOT NULL DEFAULT 0,
	`ready_by` date,
	`hold_expires_at` datetime,
	`created_at` datetime NOT NULL,
	`paid_at` datetime,
	CONSTRAINT `orders_id` PRIMARY KEY(`id`),
	CONSTRAINT `orders_ref_unique` UNIQUE(`ref`)
);
--> statement-breakpoint
CREATE TABLE `password_resets` (
	`id` varchar(64) NOT NULL,
	`user_id` varchar(36) NOT NULL,
	`expires_at` datetime NOT NULL,
	`used_at` datetime,
	CONSTRAINT `password_resets_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `photos` (
	`id` int AUTO_INCREMENT NOT NULL,
	`piece_id` int NOT NULL,
	`storage_key` varchar(200) NOT NULL,
	`alt` varchar(200) NOT NULL,
	`position` int NOT NULL DEFAULT 0,
	`width` int NOT NULL,
	`height` int NOT NULL,
	CONSTRAINT `photos_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `piece_woods` (
	`piece_id` int NOT NULL,
	`wood_id` int NOT NULL,
	CONSTRAINT `piece_woods_piece_id_wood_id_pk` PRIMARY KEY(`piece_id`,`wood_id`)
);
--> statement-breakpoint
CREATE TABLE `pieces` (
	`id` int AUTO_INCREMENT NOT NULL,
	`slug` varchar(80) NOT NULL,
	`title` varchar(120) NOT NULL,
	`kind` enum('bottle_holder','plate','box','ornament','spoon','board') NOT NULL,
	`summary` varchar(255) NOT NULL,
	`description` text NOT NULL,
	`length_mm` int NOT NULL,
	`width_mm` int NOT NULL,
	`thickness_mm` int NOT NULL,
	`base_price_minor` int NOT NULL,
	`currency` varchar(3) NOT NULL DEFAULT 'USD',
	`personalisable` boolean NOT NULL DEFAULT false,
	`food_contact` boolean NOT NULL DEFAULT false,
	`lead_days` int NOT NULL DEFAULT 14,
	`pattern` json NOT NULL,
	`active` boolean NOT NULL DEFAULT true,
	`created_at` datetime NOT NULL,
	CONSTRAINT `pieces_id` PRIMARY KEY(`id`),
	CONSTRAINT `pieces_slug_unique` UNIQUE(`slug`)
);
--> statement-breakpoint
CREATE TABLE `processed_events` (
	`id` varchar(255) NOT NULL,
	`type` varchar(100) NOT NULL,
	`processed_at` datetime NOT NULL,
	CONSTRAINT `processed_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sessions` (
	`id` varchar(64) NOT NULL,
	`user_id` varchar(36) NOT NULL,
	`expires_at` datetime NOT NULL,
	CONSTRAINT `sessions_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `settings` (
	`key` varchar(60) NOT NULL,
	`value` json NOT NULL,
	CONSTRAINT `settings_key` PRIMARY KEY(`key`)
);
--> statement-breakpoint
CREATE TABLE `shipments` (
	`id` int AUTO_INCREMENT NOT NULL,
	`order_id` int NOT NULL,
	`carrier` varchar(60) NOT NULL,
	`tracking_number` varchar(80) NOT NULL,
	`shipped_at` datetime NOT NULL,
	CONSTRAINT `shipments_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `shipping_rates` (
	`id` int AUTO_INCREMENT NOT NULL,
	`zone` varchar(20) NOT NULL,
	`up_to_grams` int NOT NULL,
	`price_minor` int NOT NULL,
	CONSTRAINT `shipping_rates_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `stock` (
	`id` int AUTO_INCREMENT NOT NULL,
	`piece_id` int NOT NULL,
	`wood_id` int NOT NULL,
	`place` varchar(40) NOT NULL DEFAULT 'workshop',
	`quantity` int NOT NULL DEFAULT 0,
	CONSTRAINT `stock_id` PRIMARY KEY(`id`),
	CONSTRAINT `stock_piece_wood_place` UNIQUE(`piece_id`,`wood_id`,`place`)
);
--> statement-breakpoint
CREATE TABLE `tallies` (
	`id` int AUTO_INCREMENT NOT NULL,
	`fair_id` int NOT NULL,
	`day` date NOT NULL,
	`cash_counted_minor` int,
	`card_reported_minor` int,
	`created_by` varchar(36),
	`created_at` datetime NOT NULL,
	CONSTRAINT `tallies_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` varchar(36) NOT NULL,
	`email` varchar(255) NOT NULL,
	`name` varchar(120) NOT NULL,
	`password_hash` varchar(255) NOT NULL,
	`role` enum('owner','helper','customer') NOT NULL DEFAULT 'customer',
	`created_at` datetime NOT NULL,
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
CREATE TABLE `woods` (
	`id` int AUTO_INCREMENT NOT NULL,
	`slug` varchar(40) NOT NULL,
	`name` varchar(80) NOT NULL,
	`botanical_name` varchar(120) NOT NULL,
	`specific_gravity_milli` int NOT NULL,
	`density_kg_m3` int NOT NULL,
	`side_hardness_n` int NOT NULL,
	`price_add_on_minor` int NOT NULL DEFAULT 0,
	`tone_light` varchar(7) NOT NULL,
	`tone_dark` varchar(7) NOT NULL,
	`character` varchar(255) NOT NULL,
	`caution` text,
	CONSTRAINT `woods_id` PRIMARY KEY(`id`),
	CONSTRAINT `woods_slug_unique` UNIQUE(`slug`)
);
--> statement-breakpoint
ALTER TABLE `booth_sales` ADD CONSTRAINT `booth_sales_fair_id_fairs_id_fk` FOREIGN KEY (`fair_id`) REFERENCES `fairs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `booth_sales` ADD CONSTRAINT `booth_sales_recorded_by_users_id_fk` FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `cart_lines` ADD CONSTRAINT `cart_lines_cart_id_carts_id_fk` FOREIGN KEY (`cart_id`) REFERENCES `carts`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `cart_lines` ADD CONSTRAINT `cart_lines_piece_id_pieces_id_fk` FOREIGN KEY (`piece_id`) REFERENCES `pieces`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `cart_lines` ADD CONSTRAINT `cart_lines_wood_id_woods_id_fk` FOREIGN KEY (`wood_id`) REFERENCES `woods`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `carts` ADD CONSTRAINT `carts_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `fair_stock` ADD CONSTRAINT `fair_stock_fair_id_fairs_id_fk` FOREIGN KEY (`fair_id`) REFERENCES `fairs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `fair_stock` ADD CONSTRAINT `fair_stock_piece_id_pieces_id_fk` FOREIGN KEY (`piece_id`) REFERENCES `pieces`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `fair_stock` ADD CONSTRAINT `fair_stock_wood_id_woods_id_fk` FOREIGN KEY (`wood_id`) REFERENCES `woods`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order_lines` ADD CONSTRAINT `order_lines_order_id_orders_id_fk` FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order_lines` ADD CONSTRAINT `order_lines_piece_id_pieces_id_fk` FOREIGN KEY (`piece_id`) REFERENCES `pieces`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `order_lines` ADD CONSTRAINT `order_lines_wood_id_woods_id_fk` FOREIGN KEY (`wood_id`) REFERENCES `woods`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `orders` ADD CONSTRAINT `orders_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `password_resets` ADD CONSTRAINT `password_resets_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `photos` ADD CONSTRAINT `photos_piece_id_pieces_id_fk` FOREIGN KEY (`piece_id`) REFERENCES `pieces`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `piece_woods` ADD CONSTRAINT `piece_woods_piece_id_pieces_id_fk` FOREIGN KEY (`piece_id`) REFERENCES `pieces`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `piece_woods` ADD CONSTRAINT `piece_woods_wood_id_woods_id_fk` FOREIGN KEY (`wood_id`) REFERENCES `woods`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sessions` ADD CONSTRAINT `sessions_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `shipments` ADD CONSTRAINT `shipments_order_id_orders_id_fk` FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `stock` ADD CONSTRAINT `stock_piece_id_pieces_id_fk` FOREIGN KEY (`piece_id`) REFERENCES `pieces`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `stock` ADD CONSTRAINT `stock_wood_id_woods_id_fk` FOREIGN KEY (`wood_id`) REFERENCES `woods`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tallies` ADD CONSTRAINT `tallies_fair_id_fairs_id_fk` FOREIGN KEY (`fair_id`) REFERENCES `fairs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tallies` ADD CONSTRAINT `tallies_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `orders_status` ON `orders` (`status`);--> statement-breakpoint
CREATE INDEX `orders_session` ON `orders` (`checkout_session_id`);