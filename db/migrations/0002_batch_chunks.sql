CREATE TABLE `batch_chunks` (
	`id` integer PRIMARY KEY AUTOINCREMENT NOT NULL,
	`check_id` integer NOT NULL,
	`chunk` integer NOT NULL,
	`points` integer NOT NULL,
	`counts` text NOT NULL,
	`worker` text NOT NULL,
	`eval_ms` real NOT NULL,
	`created_at` integer DEFAULT (unixepoch() * 1000) NOT NULL,
	FOREIGN KEY (`check_id`) REFERENCES `checks`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `batch_chunks_check_chunk` ON `batch_chunks` (`check_id`,`chunk`);