CREATE TABLE `api_tokens` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`user_id` text NOT NULL,
	`name` text NOT NULL,
	`prefix` text NOT NULL,
	`token_hash` text NOT NULL,
	`last_used_at` integer,
	`revoked_at` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `api_tokens_token_hash_unique` ON `api_tokens` (`token_hash`);--> statement-breakpoint
CREATE INDEX `api_tokens_user` ON `api_tokens` (`user_id`);--> statement-breakpoint
CREATE TABLE `audit_entries` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`actor_id` text,
	`action` text NOT NULL,
	`entity_type` text NOT NULL,
	`entity_id` text,
	`before` text,
	`after` text,
	`reason` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `audit_org_at` ON `audit_entries` (`org_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `audit_entity` ON `audit_entries` (`entity_type`,`entity_id`);--> statement-breakpoint
CREATE TABLE `budgets` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`cost_centre` text NOT NULL,
	`period_start` integer NOT NULL,
	`period_end` integer NOT NULL,
	`amount_cents` integer NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `budgets_org_centre_period` ON `budgets` (`org_id`,`cost_centre`,`period_start`);--> statement-breakpoint
CREATE TABLE `concessions` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`vehicle_id` text NOT NULL,
	`line_key` text NOT NULL,
	`reason` text NOT NULL,
	`expires_at` integer NOT NULL,
	`approved_by` text NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`approved_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `concessions_vehicle` ON `concessions` (`vehicle_id`);--> statement-breakpoint
CREATE TABLE `contractor_firms` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`name` text NOT NULL,
	`abn` text,
	`email` text NOT NULL,
	`phone` text,
	`active` integer DEFAULT true NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `firms_org_name` ON `contractor_firms` (`org_id`,`name`);--> statement-breakpoint
CREATE TABLE `costs` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`vehicle_id` text,
	`cost_centre` text NOT NULL,
	`depot_id` text,
	`category` text NOT NULL,
	`kind` text NOT NULL,
	`amount_ex_gst_cents` integer NOT NULL,
	`gst_cents` integer NOT NULL,
	`incurred_on` integer NOT NULL,
	`source` text NOT NULL,
	`job_id` text,
	`quote_id` text,
	`reference` text,
	`description` text NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`depot_id`) REFERENCES `depots`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`quote_id`) REFERENCES `quotes`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `costs_quote_id_unique` ON `costs` (`quote_id`);--> statement-breakpoint
CREATE INDEX `costs_org_incurred` ON `costs` (`org_id`,`incurred_on`);--> statement-breakpoint
CREATE INDEX `costs_org_centre` ON `costs` (`org_id`,`cost_centre`);--> statement-breakpoint
CREATE INDEX `costs_vehicle` ON `costs` (`vehicle_id`);--> statement-breakpoint
CREATE TABLE `decisions` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`quote_id` text NOT NULL,
	`decision` text NOT NULL,
	`reason` text,
	`quote_version` integer NOT NULL,
	`decided_by` text NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`quote_id`) REFERENCES `quotes`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`decided_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `decisions_quote` ON `decisions` (`quote_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `decisions_quote_version` ON `decisions` (`quote_id`,`quote_version`);--> statement-breakpoint
CREATE TABLE `defects` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`vehicle_id` text NOT NULL,
	`client_id` text NOT NULL,
	`reported_by` text,
	`severity` text NOT NULL,
	`category` text NOT NULL,
	`description` text NOT NULL,
	`odometer_km` integer,
	`latitude` real,
	`longitude` real,
	`state` text DEFAULT 'reported' NOT NULL,
	`job_id` text,
	`merged_into_id` text,
	`close_reason` text,
	`version` integer DEFAULT 1 NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`reported_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `defects_org_client` ON `defects` (`org_id`,`client_id`);--> statement-breakpoint
CREATE INDEX `defects_vehicle` ON `defects` (`vehicle_id`,`state`);--> statement-breakpoint
CREATE INDEX `defects_org_state` ON `defects` (`org_id`,`state`);--> statement-breakpoint
CREATE TABLE `depots` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`name` text NOT NULL,
	`code` text NOT NULL,
	`region` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `depots_org_code` ON `depots` (`org_id`,`code`);--> statement-breakpoint
CREATE TABLE `edition_lines` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`edition_id` text NOT NULL,
	`key` text NOT NULL,
	`code` text NOT NULL,
	`category` text NOT NULL,
	`title` text NOT NULL,
	`requirement` text NOT NULL,
	`quantity` integer DEFAULT 1 NOT NULL,
	`mass_kg` real DEFAULT 0 NOT NULL,
	`x_mm` real,
	`zone` text,
	`mass_kind` text DEFAULT 'constant' NOT NULL,
	`criteria` text DEFAULT '[]' NOT NULL,
	`evidence_needed` text DEFAULT '[]' NOT NULL,
	`standard_cost_cents` integer DEFAULT 0 NOT NULL,
	`checkable` integer DEFAULT false NOT NULL,
	`expiry_months` integer,
	`sort_order` integer DEFAULT 0 NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`edition_id`) REFERENCES `editions`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `edition_lines_edition` ON `edition_lines` (`edition_id`,`sort_order`);--> statement-breakpoint
CREATE UNIQUE INDEX `edition_lines_edition_code` ON `edition_lines` (`edition_id`,`code`);--> statement-breakpoint
CREATE TABLE `editions` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`standard_id` text NOT NULL,
	`number` integer NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`notes` text,
	`copied_from_id` text,
	`published_at` integer,
	`published_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`standard_id`) REFERENCES `standards`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`published_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `editions_standard_number` ON `editions` (`standard_id`,`number`);--> statement-breakpoint
CREATE TABLE `evidence` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`job_id` text,
	`defect_id` text,
	`check_id` text,
	`fitment_id` text,
	`line_key` text,
	`kind` text NOT NULL,
	`status` text DEFAULT 'lodged' NOT NULL,
	`filename` text NOT NULL,
	`content_type` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`sha256` text NOT NULL,
	`storage_key` text NOT NULL,
	`uploaded_by` text,
	`reviewed_by` text,
	`reviewed_at` integer,
	`review_reason` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`defect_id`) REFERENCES `defects`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`fitment_id`) REFERENCES `fitments`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`reviewed_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `evidence_job` ON `evidence` (`job_id`);--> statement-breakpoint
CREATE INDEX `evidence_defect` ON `evidence` (`defect_id`);--> statement-breakpoint
CREATE TABLE `fitments` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`vehicle_id` text NOT NULL,
	`line_key` text,
	`label` text NOT NULL,
	`quantity` integer DEFAULT 1 NOT NULL,
	`attributes` text DEFAULT '{}' NOT NULL,
	`mass_kg` real,
	`x_mm` real,
	`zone` text,
	`mass_kind` text,
	`fitted_at` integer NOT NULL,
	`removed_at` integer,
	`expires_at` integer,
	`recorded_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `fitments_vehicle` ON `fitments` (`vehicle_id`);--> statement-breakpoint
CREATE INDEX `fitments_org` ON `fitments` (`org_id`);--> statement-breakpoint
CREATE TABLE `fleet_snapshots` (
	`org_id` text NOT NULL,
	`day` text NOT NULL,
	`ready` integer NOT NULL,
	`limited` integer NOT NULL,
	`not_ready` integer NOT NULL,
	`meeting_standard` integer NOT NULL,
	`open_gaps` integer NOT NULL,
	PRIMARY KEY(`org_id`, `day`),
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `import_mappings` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`header_signature` text NOT NULL,
	`mapping` text NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `import_mappings_org_sig` ON `import_mappings` (`org_id`,`header_signature`);--> statement-breakpoint
CREATE TABLE `imports` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`filename` text NOT NULL,
	`format` text NOT NULL,
	`storage_key` text,
	`sha256` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`dry_run` integer NOT NULL,
	`total_rows` integer NOT NULL,
	`created` integer DEFAULT 0 NOT NULL,
	`updated` integer DEFAULT 0 NOT NULL,
	`unchanged` integer DEFAULT 0 NOT NULL,
	`error_count` integer DEFAULT 0 NOT NULL,
	`errors` text DEFAULT '[]' NOT NULL,
	`mapping` text,
	`created_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `imports_org_created` ON `imports` (`org_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `job_lines` (
	`id` text PRIMARY KEY NOT NULL,
	`job_id` text NOT NULL,
	`line_key` text,
	`description` text NOT NULL,
	`sort_order` integer DEFAULT 0 NOT NULL,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `job_lines_job` ON `job_lines` (`job_id`);--> statement-breakpoint
CREATE TABLE `job_offers` (
	`job_id` text NOT NULL,
	`firm_id` text NOT NULL,
	`due_at` integer,
	`created_at` integer NOT NULL,
	PRIMARY KEY(`job_id`, `firm_id`),
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`firm_id`) REFERENCES `contractor_firms`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `job_offers_firm` ON `job_offers` (`firm_id`);--> statement-breakpoint
CREATE TABLE `jobs` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`number` integer NOT NULL,
	`vehicle_id` text NOT NULL,
	`title` text NOT NULL,
	`state` text DEFAULT 'open' NOT NULL,
	`due_at` integer,
	`cost_kind` text DEFAULT 'capital' NOT NULL,
	`awarded_firm_id` text,
	`cancel_reason` text,
	`created_by` text,
	`version` integer DEFAULT 1 NOT NULL,
	`signed_off_at` integer,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`awarded_firm_id`) REFERENCES `contractor_firms`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `jobs_org_number` ON `jobs` (`org_id`,`number`);--> statement-breakpoint
CREATE INDEX `jobs_org_state` ON `jobs` (`org_id`,`state`);--> statement-breakpoint
CREATE INDEX `jobs_vehicle` ON `jobs` (`vehicle_id`);--> statement-breakpoint
CREATE TABLE `line_dependencies` (
	`line_id` text NOT NULL,
	`depends_on_line_id` text NOT NULL,
	PRIMARY KEY(`line_id`, `depends_on_line_id`),
	FOREIGN KEY (`line_id`) REFERENCES `edition_lines`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`depends_on_line_id`) REFERENCES `edition_lines`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `memberships` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`user_id` text NOT NULL,
	`role` text NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`firm_id` text,
	`depot_id` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`firm_id`) REFERENCES `contractor_firms`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`depot_id`) REFERENCES `depots`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `memberships_org_user` ON `memberships` (`org_id`,`user_id`);--> statement-breakpoint
CREATE INDEX `memberships_user` ON `memberships` (`user_id`);--> statement-breakpoint
CREATE TABLE `organisations` (
	`id` text PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`slug` text NOT NULL,
	`approval_threshold_cents` integer DEFAULT 500000 NOT NULL,
	`rule_set_id` text,
	`person_mass_kg` real DEFAULT 80 NOT NULL,
	`brake_warning_margin_kg` real DEFAULT 500 NOT NULL,
	`spring_soft_margin_kg` real DEFAULT 0 NOT NULL,
	`spring_stiff_margin_kg` real DEFAULT 500 NOT NULL,
	`weighbridge_tolerance_kg` real DEFAULT 50 NOT NULL,
	`gst_method` text DEFAULT 'per-line' NOT NULL,
	`created_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `organisations_slug_unique` ON `organisations` (`slug`);--> statement-breakpoint
CREATE TABLE `outbox_messages` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text,
	`to_address` text NOT NULL,
	`subject` text NOT NULL,
	`text_body` text NOT NULL,
	`html_body` text NOT NULL,
	`kind` text NOT NULL,
	`status` text DEFAULT 'pending' NOT NULL,
	`attempts` integer DEFAULT 0 NOT NULL,
	`next_attempt_at` integer NOT NULL,
	`last_error` text,
	`locked_until` integer,
	`sent_at` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `outbox_due` ON `outbox_messages` (`status`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `outbox_org_created` ON `outbox_messages` (`org_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `password_tokens` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`purpose` text NOT NULL,
	`token_hash` text NOT NULL,
	`expires_at` integer NOT NULL,
	`used_at` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `password_tokens_token_hash_unique` ON `password_tokens` (`token_hash`);--> statement-breakpoint
CREATE INDEX `password_tokens_user` ON `password_tokens` (`user_id`);--> statement-breakpoint
CREATE TABLE `planned_items` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`vehicle_id` text NOT NULL,
	`label` text NOT NULL,
	`mass_kg` real NOT NULL,
	`x_mm` real,
	`zone` text,
	`mass_kind` text DEFAULT 'constant' NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `planned_items_vehicle` ON `planned_items` (`vehicle_id`);--> statement-breakpoint
CREATE TABLE `platforms` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`make` text NOT NULL,
	`model` text NOT NULL,
	`variant` text DEFAULT '' NOT NULL,
	`kerb_mass_kg` real,
	`gvm_kg` real,
	`gcm_kg` real,
	`front_axle_rating_kg` real,
	`rear_axle_rating_kg` real,
	`kerb_front_kg` real,
	`wheelbase_mm` real,
	`rear_overhang_mm` real,
	`towing_capacity_kg` real,
	`towball_limit_kg` real,
	`roof_static_kg` real,
	`roof_dynamic_kg` real,
	`standard_tyre_size` text,
	`fuel_capacity_l` real,
	`top_speed_kmh` real,
	`ratings_missing` integer DEFAULT false NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `platforms_org_name` ON `platforms` (`org_id`,`make`,`model`,`variant`);--> statement-breakpoint
CREATE TABLE `pre_trip_checks` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`vehicle_id` text NOT NULL,
	`driver_id` text NOT NULL,
	`client_id` text NOT NULL,
	`items` text NOT NULL,
	`completed_at` integer NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`driver_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `checks_org_client` ON `pre_trip_checks` (`org_id`,`client_id`);--> statement-breakpoint
CREATE INDEX `checks_vehicle` ON `pre_trip_checks` (`vehicle_id`,`completed_at`);--> statement-breakpoint
CREATE TABLE `quote_lines` (
	`id` text PRIMARY KEY NOT NULL,
	`quote_id` text NOT NULL,
	`kind` text NOT NULL,
	`description` text NOT NULL,
	`quantity` real DEFAULT 1 NOT NULL,
	`unit_price_cents` integer DEFAULT 0 NOT NULL,
	`hours` real,
	`rate_cents` integer,
	`taxable` integer DEFAULT true NOT NULL,
	`line_key` text,
	`amount_cents` integer DEFAULT 0 NOT NULL,
	`gst_cents` integer DEFAULT 0 NOT NULL,
	`sort_order` integer DEFAULT 0 NOT NULL,
	FOREIGN KEY (`quote_id`) REFERENCES `quotes`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `quote_lines_quote` ON `quote_lines` (`quote_id`);--> statement-breakpoint
CREATE TABLE `quote_revisions` (
	`id` text PRIMARY KEY NOT NULL,
	`quote_id` text NOT NULL,
	`revision` integer NOT NULL,
	`snapshot` text NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`quote_id`) REFERENCES `quotes`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `quote_revisions_quote_rev` ON `quote_revisions` (`quote_id`,`revision`);--> statement-breakpoint
CREATE TABLE `quotes` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`job_id` text NOT NULL,
	`firm_id` text NOT NULL,
	`revision` integer DEFAULT 1 NOT NULL,
	`status` text DEFAULT 'draft' NOT NULL,
	`valid_until` integer,
	`notes` text,
	`gst_method` text DEFAULT 'per-line' NOT NULL,
	`subtotal_cents` integer DEFAULT 0 NOT NULL,
	`gst_cents` integer DEFAULT 0 NOT NULL,
	`total_cents` integer DEFAULT 0 NOT NULL,
	`submitted_by` text,
	`submitted_at` integer,
	`version` integer DEFAULT 1 NOT NULL,
	`created_by` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`firm_id`) REFERENCES `contractor_firms`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`submitted_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `quotes_job` ON `quotes` (`job_id`);--> statement-breakpoint
CREATE INDEX `quotes_org_status` ON `quotes` (`org_id`,`status`);--> statement-breakpoint
CREATE TABLE `rate_limits` (
	`key` text PRIMARY KEY NOT NULL,
	`count` integer NOT NULL,
	`reset_at` integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE `rule_sets` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text,
	`name` text NOT NULL,
	`example_only` integer DEFAULT true NOT NULL,
	`limits` text NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE TABLE `standards` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`name` text NOT NULL,
	`description` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `standards_org_name` ON `standards` (`org_id`,`name`);--> statement-breakpoint
CREATE TABLE `users` (
	`id` text PRIMARY KEY NOT NULL,
	`email` text NOT NULL,
	`name` text NOT NULL,
	`password_hash` text,
	`session_version` integer DEFAULT 1 NOT NULL,
	`notify_non_essential` integer DEFAULT true NOT NULL,
	`last_sign_in_at` integer,
	`created_at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_unique` ON `users` (`email`);--> statement-breakpoint
CREATE TABLE `vehicle_drivers` (
	`vehicle_id` text NOT NULL,
	`user_id` text NOT NULL,
	PRIMARY KEY(`vehicle_id`, `user_id`),
	FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `vehicle_drivers_user` ON `vehicle_drivers` (`user_id`);--> statement-breakpoint
CREATE TABLE `vehicles` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`fleet_number` text NOT NULL,
	`vin` text,
	`registration` text,
	`registration_expiry` integer,
	`platform_id` text NOT NULL,
	`depot_id` text,
	`cost_centre` text,
	`edition_id` text,
	`state` text DEFAULT 'in_service' NOT NULL,
	`grounded_reason` text,
	`odometer_km` integer,
	`build_year` integer,
	`measured_front_kg` real,
	`measured_rear_kg` real,
	`measured_gross_kg` real,
	`measured_at` integer,
	`notes` text,
	`version` integer DEFAULT 1 NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`platform_id`) REFERENCES `platforms`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`depot_id`) REFERENCES `depots`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`edition_id`) REFERENCES `editions`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE UNIQUE INDEX `vehicles_org_fleet_number` ON `vehicles` (`org_id`,`fleet_number`);--> statement-breakpoint
CREATE UNIQUE INDEX `vehicles_org_vin` ON `vehicles` (`org_id`,`vin`);--> statement-breakpoint
CREATE INDEX `vehicles_org_depot` ON `vehicles` (`org_id`,`depot_id`);--> statement-breakpoint
CREATE INDEX `vehicles_org_platform` ON `vehicles` (`org_id`,`platform_id`);--> statement-breakpoint
CREATE INDEX `vehicles_org_state` ON `vehicles` (`org_id`,`state`);--> statement-breakpoint
CREATE INDEX `vehicles_org_edition` ON `vehicles` (`org_id`,`edition_id`);--> statement-breakpoint
CREATE INDEX `vehicles_org_registration` ON `vehicles` (`org_id`,`registration`);--> statement-breakpoint
CREATE TABLE `weighbridge_tickets` (
	`id` text PRIMARY KEY NOT NULL,
	`org_id` text NOT NULL,
	`vehicle_id` text NOT NULL,
	`job_id` text,
	`ticket_number` text NOT NULL,
	`weighed_at` integer NOT NULL,
	`front_kg` real NOT NULL,
	`rear_kg` real NOT NULL,
	`gross_kg` real NOT NULL,
	`evidence_id` text,
	`recorded_by` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`org_id`) REFERENCES `organisations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`vehicle_id`) REFERENCES `vehicles`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`job_id`) REFERENCES `jobs`(`id`) ON UPDATE no action ON DELETE set null,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `weighbridge_vehicle` ON `weighbridge_tickets` (`vehicle_id`,`weighed_at`);