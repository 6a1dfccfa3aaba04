CREATE TABLE `checkout_details` (
	`cart_id` varchar(36) NOT NULL,
	`name` varchar(120) NOT NULL,
	`email` varchar(255) NOT NULL,
	`address` json NOT NULL,
	`gift_note` varchar(500),
	`saved_at` datetime NOT NULL,
	CONSTRAINT `checkout_details_cart_id` PRIMARY KEY(`cart_id`)
);
--> statement-breakpoint
ALTER TABLE `users` ADD `email_confirmed_at` datetime;--> statement-breakpoint
ALTER TABLE `checkout_details` ADD CONSTRAINT `checkout_details_cart_id_carts_id_fk` FOREIGN KEY (`cart_id`) REFERENCES `carts`(`id`) ON DELETE cascade ON UPDATE no action;