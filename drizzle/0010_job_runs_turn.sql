ALTER TABLE `job_runs` ADD `turn` bigint;--> statement-breakpoint
ALTER TABLE `job_runs` ADD CONSTRAINT `job_runs_name_turn` UNIQUE(`name`,`turn`);