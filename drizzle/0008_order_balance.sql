ALTER TABLE `orders` ADD `balance_paid_at` datetime;--> statement-breakpoint
ALTER TABLE `orders` ADD `balance_method` enum('cash','card','transfer','other');