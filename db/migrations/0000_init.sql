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
	`comeback_of_ticket_id` text,
	`version` integer DEFAULT 1 NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`closed_at` integer,
	FOREIGN KEY (`machine_id`) REFERENCES `machines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`customer_id`) REFERENCES `customers`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`assigned_tech_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`comeback_of_ticket_id`) REFERENCES `tickets`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `tickets_number_unique` ON `tickets` (`number`);--> statement-breakpoint
CREATE UNIQUE INDEX `tickets_tag_code_unique` ON `tickets` (`tag_code`);--> statement-breakpoint
CREATE INDEX `tickets_status_idx` ON `tickets` (`status`);--> statement-breakpoint
CREATE INDEX `tickets_machine_idx` ON `tickets` (`machine_id`);--> statement-breakpoint
CREATE INDEX `tickets_customer_idx` ON `tickets` (`customer_id`);--> statement-breakpoint
CREATE INDEX `tickets_tech_idx` ON `tickets` (`assigned_tech_id`);--> statement-breakpoint
CREATE INDEX `tickets_status_promised_idx` ON `tickets` (`status`,`promised_date`);--> statement-breakpoint
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
CREATE UNIQUE INDEX `users_email_unique` ON `users` (`email`);--> statement-breakpoint
CREATE TABLE `ticket_handbacks` (
	`ticket_id` text PRIMARY KEY NOT NULL,
	`outcome` text NOT NULL,
	`collected_by` text NOT NULL,
	`collected_at` integer NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`recorded_by_id` text,
	`recorded_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`ticket_id`) REFERENCES `tickets`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `ticket_tags` (
	`code` text PRIMARY KEY NOT NULL,
	`ticket_id` text NOT NULL,
	`retired_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`retired_by_id` text,
	`reason` text DEFAULT '' NOT NULL,
	FOREIGN KEY (`ticket_id`) REFERENCES `tickets`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`retired_by_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `ticket_tags_ticket_idx` ON `ticket_tags` (`ticket_id`);--> statement-breakpoint
CREATE TABLE `bench_entries` (
	`id` text PRIMARY KEY NOT NULL,
	`ticket_id` text NOT NULL,
	`procedure_id` text NOT NULL,
	`procedure_version` integer NOT NULL,
	`step_id` text NOT NULL,
	`value` text NOT NULL,
	`note` text,
	`at` integer NOT NULL,
	`recorded_by` text NOT NULL,
	`voided_at` integer,
	`voided_by` text,
	`void_reason` text,
	FOREIGN KEY (`ticket_id`) REFERENCES `tickets`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`voided_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `bench_entries_ticket_step_idx` ON `bench_entries` (`ticket_id`,`step_id`);--> statement-breakpoint
CREATE TABLE `findings` (
	`id` text PRIMARY KEY NOT NULL,
	`ticket_id` text NOT NULL,
	`step_id` text,
	`grade` text NOT NULL,
	`title` text NOT NULL,
	`note` text DEFAULT '' NOT NULL,
	`photo_ids` text DEFAULT '[]' NOT NULL,
	`suggested_parts` text DEFAULT '[]' NOT NULL,
	`suggested_labor_minutes` integer,
	`alternatives` text,
	`withdrawn` integer DEFAULT false NOT NULL,
	`created_by` text NOT NULL,
	`at` integer NOT NULL,
	`changed_at` integer,
	`changed_by` text,
	`revision` integer DEFAULT 1 NOT NULL,
	FOREIGN KEY (`ticket_id`) REFERENCES `tickets`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`changed_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `findings_ticket_idx` ON `findings` (`ticket_id`);--> statement-breakpoint
CREATE TABLE `labor_entries` (
	`id` text PRIMARY KEY NOT NULL,
	`ticket_id` text NOT NULL,
	`user_id` text NOT NULL,
	`started_at` integer NOT NULL,
	`ended_at` integer,
	FOREIGN KEY (`ticket_id`) REFERENCES `tickets`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `labor_entries_ticket_idx` ON `labor_entries` (`ticket_id`);--> statement-breakpoint
CREATE TABLE `parts_used` (
	`id` text PRIMARY KEY NOT NULL,
	`ticket_id` text NOT NULL,
	`description` text NOT NULL,
	`part_number` text,
	`qty` real NOT NULL,
	`unit_price_cents` integer,
	`at` integer NOT NULL,
	`recorded_by` text NOT NULL,
	FOREIGN KEY (`ticket_id`) REFERENCES `tickets`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `parts_used_ticket_idx` ON `parts_used` (`ticket_id`);--> statement-breakpoint
CREATE TABLE `photo_files` (
	`sha256` text PRIMARY KEY NOT NULL,
	`mime` text NOT NULL,
	`bytes` integer NOT NULL,
	`file_name` text NOT NULL,
	`uploaded_by` text,
	`stored_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE TABLE `photos` (
	`id` text PRIMARY KEY NOT NULL,
	`ticket_id` text NOT NULL,
	`sha256` text NOT NULL,
	`mime` text NOT NULL,
	`bytes` integer NOT NULL,
	`width` integer,
	`height` integer,
	`step_id` text,
	`finding_id` text,
	`caption` text,
	`at` integer NOT NULL,
	`taken_by` text NOT NULL,
	FOREIGN KEY (`ticket_id`) REFERENCES `tickets`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`sha256`) REFERENCES `photo_files`(`sha256`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`taken_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `photos_ticket_idx` ON `photos` (`ticket_id`);--> statement-breakpoint
CREATE TABLE `procedures` (
	`id` text PRIMARY KEY NOT NULL,
	`machine_kind` text NOT NULL,
	`name` text NOT NULL,
	`version` integer DEFAULT 1 NOT NULL,
	`definition` text NOT NULL,
	`updated_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL
);
--> statement-breakpoint
CREATE TABLE `ticket_notes` (
	`id` text PRIMARY KEY NOT NULL,
	`ticket_id` text NOT NULL,
	`text` text NOT NULL,
	`at` integer NOT NULL,
	`author_id` text NOT NULL,
	FOREIGN KEY (`ticket_id`) REFERENCES `tickets`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`author_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `ticket_notes_ticket_idx` ON `ticket_notes` (`ticket_id`);--> statement-breakpoint
CREATE TABLE `tune_entries` (
	`id` text PRIMARY KEY NOT NULL,
	`ticket_id` text NOT NULL,
	`screw` text NOT NULL,
	`kind` text NOT NULL,
	`direction` text,
	`eighths` integer NOT NULL,
	`baseline_kind` text,
	`at` integer NOT NULL,
	`recorded_by` text NOT NULL,
	FOREIGN KEY (`ticket_id`) REFERENCES `tickets`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`recorded_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `tune_entries_ticket_idx` ON `tune_entries` (`ticket_id`);--> statement-breakpoint
CREATE TABLE `applied_mutations` (
	`mutation_id` text PRIMARY KEY NOT NULL,
	`device_id` text NOT NULL,
	`seq` integer NOT NULL,
	`name` text NOT NULL,
	`user_id` text NOT NULL,
	`outcome` text NOT NULL,
	`reason` text,
	`args` text,
	`at` integer NOT NULL,
	`applied_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`device_id`) REFERENCES `devices`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `applied_mutations_device_seq_unique` ON `applied_mutations` (`device_id`,`seq`);--> statement-breakpoint
CREATE TABLE `change_log` (
	`version` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`entity` text NOT NULL,
	`entity_id` text NOT NULL,
	`op` text NOT NULL,
	`at` integer NOT NULL
);
--> statement-breakpoint
CREATE UNIQUE INDEX `change_log_entity_unique` ON `change_log` (`entity`,`entity_id`);--> statement-breakpoint
CREATE TABLE `devices` (
	`id` text PRIMARY KEY NOT NULL,
	`user_id` text NOT NULL,
	`last_seq` integer DEFAULT 0 NOT NULL,
	`pending_count` integer DEFAULT 0 NOT NULL,
	`pending_tickets` text DEFAULT '[]' NOT NULL,
	`reported_at` integer,
	`user_agent` text DEFAULT '' NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`last_seen_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `devices_user_idx` ON `devices` (`user_id`);--> statement-breakpoint
CREATE TABLE `sync_conflicts` (
	`id` text PRIMARY KEY NOT NULL,
	`ticket_id` text NOT NULL,
	`field` text NOT NULL,
	`device_value` text NOT NULL,
	`server_value` text NOT NULL,
	`base_version` integer NOT NULL,
	`server_version` integer NOT NULL,
	`mutation_id` text NOT NULL,
	`device_id` text NOT NULL,
	`user_id` text NOT NULL,
	`created_at` integer DEFAULT (cast(unixepoch('subsecond') * 1000 as integer)) NOT NULL,
	`resolved_at` integer,
	`resolved_by` text,
	`resolution` text,
	FOREIGN KEY (`ticket_id`) REFERENCES `tickets`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`resolved_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `sync_conflicts_ticket_idx` ON `sync_conflicts` (`ticket_id`);--> statement-breakpoint
CREATE INDEX `sync_conflicts_open_idx` ON `sync_conflicts` (`resolved_at`);