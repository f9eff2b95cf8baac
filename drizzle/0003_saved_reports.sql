CREATE TABLE `saved_reports` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`organization_id` integer NOT NULL,
	`squad_id` integer NOT NULL,
	`test_id` integer NOT NULL,
	`from_session_id` integer NOT NULL,
	`to_session_id` integer NOT NULL,
	`settings` text NOT NULL,
	`snapshot` text NOT NULL,
	`note` text NOT NULL,
	`created_by` integer,
	`created_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`organization_id`) REFERENCES `organizations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`squad_id`) REFERENCES `squads`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`test_id`) REFERENCES `tests`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`from_session_id`) REFERENCES `testing_sessions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`to_session_id`) REFERENCES `testing_sessions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
CREATE INDEX `saved_reports_org_squad_idx` ON `saved_reports` (`organization_id`,`squad_id`,`created_at`);