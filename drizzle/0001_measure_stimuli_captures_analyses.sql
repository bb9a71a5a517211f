CREATE TABLE `analyses` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`kind` varchar(32) NOT NULL,
	`status` varchar(16) NOT NULL,
	`progress` double NOT NULL,
	`capture_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin,
	`stimulus_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin,
	`request` json NOT NULL,
	`dut_model` varchar(100),
	`dut_serial` varchar(100),
	`dut_lot` varchar(100),
	`tags` json NOT NULL,
	`rerun_of` varchar(32) CHARACTER SET ascii COLLATE ascii_bin,
	`audio_seconds` double NOT NULL,
	`attempts` int NOT NULL,
	`lease_owner` varchar(64),
	`lease_expires_at` datetime(3),
	`cancel_requested` int NOT NULL,
	`result_json` longtext,
	`error` json,
	`verdict` varchar(16),
	`calibration` json,
	`engine_version` varchar(64),
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	`started_at` datetime(3),
	`finished_at` datetime(3),
	CONSTRAINT `analyses_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `captures` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`filename` varchar(255) NOT NULL,
	`sha256` char(64) NOT NULL,
	`size_bytes` bigint unsigned NOT NULL,
	`sample_rate_hz` int NOT NULL,
	`channel_count` int NOT NULL,
	`frame_count` bigint unsigned NOT NULL,
	`duration_seconds` double NOT NULL,
	`format` json NOT NULL,
	`channel_stats` json NOT NULL,
	`warnings` json NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `captures_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `stimuli` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`name` varchar(100),
	`type` varchar(32) NOT NULL,
	`parameters` json NOT NULL,
	`sample_rate_hz` int NOT NULL,
	`engine_version` varchar(64) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `stimuli_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `analyses` ADD CONSTRAINT `analyses_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `analyses` ADD CONSTRAINT `analyses_capture_id_captures_id_fk` FOREIGN KEY (`capture_id`) REFERENCES `captures`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `analyses` ADD CONSTRAINT `analyses_stimulus_id_stimuli_id_fk` FOREIGN KEY (`stimulus_id`) REFERENCES `stimuli`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `captures` ADD CONSTRAINT `captures_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `stimuli` ADD CONSTRAINT `stimuli_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `analyses_organisation_created_idx` ON `analyses` (`organisation_id`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `analyses_queue_idx` ON `analyses` (`status`,`created_at`);--> statement-breakpoint
CREATE INDEX `analyses_capture_idx` ON `analyses` (`capture_id`);--> statement-breakpoint
CREATE INDEX `analyses_dut_idx` ON `analyses` (`organisation_id`,`dut_model`,`dut_lot`);--> statement-breakpoint
CREATE INDEX `captures_organisation_created_idx` ON `captures` (`organisation_id`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `captures_sha256_idx` ON `captures` (`sha256`);--> statement-breakpoint
CREATE INDEX `stimuli_organisation_created_idx` ON `stimuli` (`organisation_id`,`created_at`,`id`);