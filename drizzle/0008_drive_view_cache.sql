CREATE TABLE `drive_view_cache` (
	`drive_id` bigint unsigned NOT NULL,
	`view` varchar(32) NOT NULL,
	`body` json NOT NULL,
	`body_version` int unsigned NOT NULL,
	`computed_at` timestamp(3) NOT NULL,
	CONSTRAINT `drive_view_cache_drive_id_view_pk` PRIMARY KEY(`drive_id`,`view`)
);
--> statement-breakpoint
ALTER TABLE `drive_view_cache` ADD CONSTRAINT `drive_view_cache_drive_id_drives_id_fk` FOREIGN KEY (`drive_id`) REFERENCES `drives`(`id`) ON DELETE cascade ON UPDATE no action;