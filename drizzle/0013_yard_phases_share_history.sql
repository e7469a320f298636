CREATE TABLE `yard_share_history` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`yard_id` bigint unsigned NOT NULL,
	`day` date NOT NULL,
	`action` enum('planted','removed') NOT NULL,
	`items` int unsigned NOT NULL,
	`count_share` double,
	`area_share` double,
	`volume_share` double,
	`planned_count_share` double,
	`planned_area_share` double,
	`planned_volume_share` double,
	`native_area_added` double NOT NULL DEFAULT 0,
	`lawn_removed` double NOT NULL DEFAULT 0,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `yard_share_history_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `pledges` ADD `planned_count_share` double DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `pledges` ADD `planned_area_share` double DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `pledges` ADD `planned_volume_share` double DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `yard_share_history` ADD CONSTRAINT `yard_share_history_yard_id_yards_id_fk` FOREIGN KEY (`yard_id`) REFERENCES `yards`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `yard_share_history_yard_day_idx` ON `yard_share_history` (`yard_id`,`day`,`id`);