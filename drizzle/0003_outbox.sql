CREATE TABLE `outbox` (
	`id` int AUTO_INCREMENT NOT NULL,
	`recipients` varchar(1000) NOT NULL,
	`subject` varchar(300) NOT NULL,
	`text_body` text NOT NULL,
	`html_body` text,
	`reply_to` varchar(255),
	`status` enum('pending','sent') NOT NULL DEFAULT 'pending',
	`attempts` int NOT NULL DEFAULT 0,
	`last_error` varchar(500),
	`claimed_by` varchar(64),
	`claimed_until` datetime,
	`message_id` varchar(255),
	`created_at` datetime NOT NULL,
	`sent_at` datetime,
	CONSTRAINT `outbox_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE INDEX `outbox_status_idx` ON `outbox` (`status`,`claimed_until`);