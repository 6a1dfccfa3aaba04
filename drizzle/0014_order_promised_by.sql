ALTER TABLE `orders` ADD `promised_by` date;--> statement-breakpoint
-- Orders already paid keep the day they were last given as their promise.
UPDATE `orders` SET `promised_by` = `ready_by` WHERE `ready_by` IS NOT NULL AND `status` NOT IN ('pending', 'cancelled');
