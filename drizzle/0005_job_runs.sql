CREATE TABLE `job_runs` (
	`id` int AUTO_INCREMENT NOT NULL,
	`name` varchar(64) NOT NULL,
	`ran_at` datetime(3) NOT NULL,
	`ran_by` varchar(120) NOT NULL,
	`count` int NOT NULL DEFAULT 0,
	CONSTRAINT `job_runs_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE INDEX `job_runs_name_ran_at` ON `job_runs` (`name`,`ran_at`);