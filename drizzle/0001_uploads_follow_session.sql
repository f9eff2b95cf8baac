PRAGMA foreign_keys=OFF;--> statement-breakpoint
CREATE TABLE `__new_uploads` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`organization_id` integer NOT NULL,
	`session_id` integer,
	`filename` text NOT NULL,
	`size_bytes` integer NOT NULL,
	`content_type` text,
	`content` blob NOT NULL,
	`format` text,
	`rows_imported` integer DEFAULT 0 NOT NULL,
	`created_by` integer,
	`created_at` integer DEFAULT (cast(unixepoch('subsec') * 1000 as integer)) NOT NULL,
	FOREIGN KEY (`organization_id`) REFERENCES `organizations`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`session_id`) REFERENCES `testing_sessions`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON UPDATE no action ON DELETE set null
);
--> statement-breakpoint
INSERT INTO `__new_uploads`("id", "organization_id", "session_id", "filename", "size_bytes", "content_type", "content", "format", "rows_imported", "created_by", "created_at") SELECT "id", "organization_id", "session_id", "filename", "size_bytes", "content_type", "content", "format", "rows_imported", "created_by", "created_at" FROM `uploads`;--> statement-breakpoint
DROP TABLE `uploads`;--> statement-breakpoint
ALTER TABLE `__new_uploads` RENAME TO `uploads`;--> statement-breakpoint
PRAGMA foreign_keys=ON;--> statement-breakpoint
CREATE INDEX `uploads_org_idx` ON `uploads` (`organization_id`);