CREATE TABLE `catalogue_version` (
	`id` tinyint NOT NULL,
	`n` bigint unsigned NOT NULL DEFAULT 0,
	CONSTRAINT `catalogue_version_id` PRIMARY KEY(`id`)
);
