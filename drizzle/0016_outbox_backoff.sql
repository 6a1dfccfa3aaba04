ALTER TABLE `outbox` MODIFY COLUMN `status` enum('pending','sent','failed') NOT NULL DEFAULT 'pending';--> statement-breakpoint
ALTER TABLE `outbox` ADD `failed_at` datetime;--> statement-breakpoint
ALTER TABLE `outbox` ADD `retried_at` datetime;