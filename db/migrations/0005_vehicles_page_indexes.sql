DROP INDEX `vehicles_org_edition`;--> statement-breakpoint
CREATE INDEX `vehicles_org_id` ON `vehicles` (`org_id`,`id`);--> statement-breakpoint
CREATE INDEX `vehicles_org_fleet_number_id` ON `vehicles` (`org_id`,`fleet_number`,`id`);--> statement-breakpoint
CREATE INDEX `vehicles_org_edition` ON `vehicles` (`org_id`,`edition_id`,`id`);