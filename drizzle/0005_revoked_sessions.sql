CREATE TABLE `revoked_sessions` (
	`session_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`user_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `revoked_sessions_session_id` PRIMARY KEY(`session_id`)
);
--> statement-breakpoint
CREATE INDEX `revoked_sessions_expires_idx` ON `revoked_sessions` (`expires_at`);