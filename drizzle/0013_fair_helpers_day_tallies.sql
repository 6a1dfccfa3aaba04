CREATE TABLE `fair_helpers` (
	`fair_id` int NOT NULL,
	`user_id` varchar(36) NOT NULL,
	`added_at` datetime NOT NULL,
	CONSTRAINT `fair_helpers_fair_id_user_id_pk` PRIMARY KEY(`fair_id`,`user_id`)
);
--> statement-breakpoint
CREATE TABLE `tally_counts` (
	`tally_id` int NOT NULL,
	`fair_stock_id` int NOT NULL,
	`counted` int NOT NULL,
	CONSTRAINT `tally_counts_tally_id_fair_stock_id_pk` PRIMARY KEY(`tally_id`,`fair_stock_id`)
);
--> statement-breakpoint
ALTER TABLE `tallies` ADD `first_cash_counted_minor` int;--> statement-breakpoint
ALTER TABLE `tallies` ADD `counts` int DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `tallies` ADD `last_save_id` varchar(36);--> statement-breakpoint
ALTER TABLE `tallies` ADD CONSTRAINT `tallies_fair_day` UNIQUE(`fair_id`,`day`);--> statement-breakpoint
ALTER TABLE `fair_helpers` ADD CONSTRAINT `fair_helpers_fair_id_fairs_id_fk` FOREIGN KEY (`fair_id`) REFERENCES `fairs`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `fair_helpers` ADD CONSTRAINT `fair_helpers_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tally_counts` ADD CONSTRAINT `tally_counts_tally_id_tallies_id_fk` FOREIGN KEY (`tally_id`) REFERENCES `tallies`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `tally_counts` ADD CONSTRAINT `tally_counts_fair_stock_id_fair_stock_id_fk` FOREIGN KEY (`fair_stock_id`) REFERENCES `fair_stock`(`id`) ON DELETE cascade ON UPDATE no action;