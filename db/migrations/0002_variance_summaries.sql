CREATE TABLE `vehicle_variance_summaries` (
	`vehicle_id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`edition_id` text NOT NULL,
	`status` text,
	`meets` integer DEFAULT 0 NOT NULL,
	`short` integer DEFAULT 0 NOT NULL,
	`off_spec` integer DEFAULT 0 NOT NULL,
	`unproven` integer DEFAULT 0 NOT NULL,
	`concession` integer DEFAULT 0 NOT NULL,
	`prohibited_fitted` integer DEFAULT 0 NOT NULL,
	`extra` integer DEFAULT 0 NOT NULL,
	`cost_to_close_cents` integer DEFAULT 0 NOT NULL,
	`mass_to_close_g` integer DEFAULT 0 NOT NULL,
	`computed_at` integer NOT NULL,
	`valid_until` integer,
	`claim` text,
	`rules_version` integer DEFAULT 0 NOT NULL,
	FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`edition_id`) REFERENCES `editions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `vehicle_variance_summaries_org` ON `vehicle_variance_summaries` (`org_id`);--> statement-breakpoint
CREATE INDEX `vehicle_variance_summaries_edition` ON `vehicle_variance_summaries` (`edition_id`);