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
ALTER TABLE `tickets` ADD `comeback_of_ticket_id` text REFERENCES tickets(id);--> statement-breakpoint
CREATE INDEX `tickets_status_promised_idx` ON `tickets` (`status`,`promised_date`);