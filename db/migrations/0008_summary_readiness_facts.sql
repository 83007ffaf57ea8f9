ALTER TABLE `vehicle_variance_summaries` ADD `critical_gaps` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `vehicle_variance_summaries` ADD `earliest_expiry_at` integer;