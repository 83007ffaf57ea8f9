CREATE TABLE `dev_mailbox` (
	`id` text PRIMARY KEY NOT NULL,
	`to_address` text NOT NULL,
	`from_address` text NOT NULL,
	`subject` text NOT NULL,
	`text_body` text NOT NULL,
	`html_body` text,
	`created_at` integer NOT NULL
);
--> statement-breakpoint
CREATE INDEX `dev_mailbox_received` ON `dev_mailbox` (`created_at`);--> statement-breakpoint
CREATE INDEX `dev_mailbox_to` ON `dev_mailbox` (`to_address`);