DROP INDEX `pledges_drive_neighbourhood_idx` ON `pledges`;--> statement-breakpoint
DROP INDEX `pledges_drive_day_idx` ON `pledges`;--> statement-breakpoint
CREATE INDEX `pledges_dashboard_idx` ON `pledges` (`drive_id`,`consent`,`neighbourhood`,`status`,`count_share`,`area_share`,`volume_share`,`area_native`,`base_area_native`,`lawn_area`,`base_lawn_area`);--> statement-breakpoint
CREATE INDEX `pledges_drive_day_yard_idx` ON `pledges` (`drive_id`,`consent`,`pledged_on`,`yard_id`);--> statement-breakpoint
CREATE INDEX `share_snapshots_yard_day_shares_idx` ON `share_snapshots` (`yard_id`,`day`,`count_share`,`area_share`,`volume_share`);