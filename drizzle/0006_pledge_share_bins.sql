ALTER TABLE `pledges` ADD `count_bin` tinyint GENERATED ALWAYS AS (LEAST(FLOOR(count_share * 10), 9)) STORED;--> statement-breakpoint
ALTER TABLE `pledges` ADD `area_bin` tinyint GENERATED ALWAYS AS (LEAST(FLOOR(area_share * 10), 9)) STORED;--> statement-breakpoint
ALTER TABLE `pledges` ADD `volume_bin` tinyint GENERATED ALWAYS AS (LEAST(FLOOR(volume_share * 10), 9)) STORED;--> statement-breakpoint
CREATE INDEX `pledges_drive_count_bin_idx` ON `pledges` (`drive_id`,`consent`,`count_bin`);--> statement-breakpoint
CREATE INDEX `pledges_drive_area_bin_idx` ON `pledges` (`drive_id`,`consent`,`area_bin`);--> statement-breakpoint
CREATE INDEX `pledges_drive_volume_bin_idx` ON `pledges` (`drive_id`,`consent`,`volume_bin`);