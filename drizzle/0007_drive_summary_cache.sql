CREATE TABLE `drive_summaries` (
	`drive_id` bigint unsigned NOT NULL,
	`version` int unsigned NOT NULL DEFAULT 1,
	`body` json,
	`body_version` int unsigned,
	`computed_at` timestamp(3),
	CONSTRAINT `drive_summaries_drive_id` PRIMARY KEY(`drive_id`)
);
--> statement-breakpoint
ALTER TABLE `drive_summaries` ADD CONSTRAINT `drive_summaries_drive_id_drives_id_fk` FOREIGN KEY (`drive_id`) REFERENCES `drives`(`id`) ON DELETE cascade ON UPDATE no action;