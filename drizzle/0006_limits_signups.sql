CREATE TABLE `pending_signups` (
	`id` varchar(64) NOT NULL,
	`email` varchar(255) NOT NULL,
	`name` varchar(120) NOT NULL,
	`password_hash` varchar(255) NOT NULL,
	`expires_at` datetime NOT NULL,
	CONSTRAINT `pending_signups_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `rate_limits` (
	`key` varchar(255) NOT NULL,
	`points` int NOT NULL DEFAULT 0,
	`expire` bigint unsigned,
	CONSTRAINT `rate_limits_key` PRIMARY KEY(`key`)
);
