CREATE TABLE `audit_log` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`actor_id` text,
	`action` text NOT NULL,
	`entity` text NOT NULL,
	`entity_id` text NOT NULL,
	`details` text DEFAULT '{}' NOT NULL,
	FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `audit_entity_idx` ON `audit_log` (`entity`,`entity_id`);--> statement-breakpoint
CREATE INDEX `audit_at_idx` ON `audit_log` (`at`);--> statement-breakpoint
CREATE TABLE `customers` (
	`id` text PRIMARY KEY NOT NULL,
	`first_name` text DEFAULT '' NOT NULL,
	`last_name` text NOT NULL,
	`phone` text DEFAULT '' NOT NULL,
	`email` text DEFAULT '' NOT NULL,
	`contact_preference` text DEFAULT 'phone' NOT NULL,
	`email_consent` integer DEFAULT false NOT NULL,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL
);
--> statement-breakpoint
CREATE INDEX `customers_last_name_idx` ON `customers` (`last_name`);--> statement-breakpoint
CREATE INDEX `customers_phone_idx` ON `customers` (`phone`);--> statement-breakpoint
CREATE TABLE `machines` (
	`id` text PRIMARY KEY NOT NULL,
	`customer_id` text,
	`kind` text NOT NULL,
	`engine_type` text NOT NULL,
	`make` text NOT NULL,
	`model` text DEFAULT '' NOT NULL,
	`serial` text DEFAULT '' NOT NULL,
	`displacement_cc` integer,
	`sticker_code` text,
	`notes` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`customer_id`) REFERENCES `customers`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `machines_serial_idx` ON `machines` (`serial`);--> statement-breakpoint
CREATE INDEX `machines_customer_idx` ON `machines` (`customer_id`);--> statement-breakpoint
CREATE UNIQUE INDEX `machines_sticker_code_unique` ON `machines` (`sticker_code`);--> statement-breakpoint
CREATE TABLE `shop_settings` (
	`id` integer PRIMARY KEY NOT NULL,
	`name` text NOT NULL,
	`phone` text DEFAULT '' NOT NULL,
	`email` text DEFAULT '' NOT NULL,
	`address` text DEFAULT '' NOT NULL,
	`timezone` text DEFAULT 'America/Chicago' NOT NULL,
	`currency` text DEFAULT 'USD' NOT NULL,
	`labor_rate_cents_per_hour` integer DEFAULT 9000 NOT NULL,
	`labor_increment_minutes` integer DEFAULT 6 NOT NULL,
	`tax_rate_ppm` integer DEFAULT 0 NOT NULL,
	`labor_taxable` integer DEFAULT false NOT NULL,
	`tax_rounding` text DEFAULT 'invoice' NOT NULL,
	`shop_supplies_bp` integer DEFAULT 0 NOT NULL,
	`shop_supplies_cap_cents` integer DEFAULT 0 NOT NULL,
	`comeback_window_days` integer DEFAULT 30 NOT NULL,
	`next_ticket_number` integer DEFAULT 1001 NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `sign_in_attempts` (
	`key` text PRIMARY KEY NOT NULL,
	`failures` integer DEFAULT 0 NOT NULL,
	`window_started_at` integer NOT NULL,
	`locked_until` integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
CREATE TABLE `tickets` (
	`id` text PRIMARY KEY NOT NULL,
	`number` integer NOT NULL,
	`tag_code` text NOT NULL,
	`machine_id` text NOT NULL,
	`customer_id` text NOT NULL,
	`complaint` text NOT NULL,
	`complaint_tags` text DEFAULT '[]' NOT NULL,
	`intake_condition` text DEFAULT '{"flags":[],"note":""}' NOT NULL,
	`accessories` text DEFAULT '' NOT NULL,
	`status` text DEFAULT 'taken_in' NOT NULL,
	`promised_date` text,
	`approval_limit_cents` integer,
	`assigned_tech_id` text,
	`created_by_id` text,
	`version` integer DEFAULT 1 NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`closed_at` integer,
	FOREIGN KEY (`machine_id`) REFERENCES `machines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`customer_id`) REFERENCES `customers`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`assigned_tech_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `tickets_number_unique` ON `tickets` (`number`);--> statement-breakpoint
CREATE UNIQUE INDEX `tickets_tag_code_unique` ON `tickets` (`tag_code`);--> statement-breakpoint
CREATE INDEX `tickets_status_idx` ON `tickets` (`status`);--> statement-breakpoint
CREATE INDEX `tickets_machine_idx` ON `tickets` (`machine_id`);--> statement-breakpoint
CREATE INDEX `tickets_customer_idx` ON `tickets` (`customer_id`);--> statement-breakpoint
CREATE INDEX `tickets_tech_idx` ON `tickets` (`assigned_tech_id`);--> statement-breakpoint
CREATE TABLE `users` (
	`id` text PRIMARY KEY NOT NULL,
	`email` text NOT NULL,
	`name` text NOT NULL,
	`role` text NOT NULL,
	`active` integer DEFAULT true NOT NULL,
	`password_hash` text NOT NULL,
	`session_version` integer DEFAULT 1 NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `users_email_unique` ON `users` (`email`);