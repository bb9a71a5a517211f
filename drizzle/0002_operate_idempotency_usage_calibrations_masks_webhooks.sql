CREATE TABLE `calibrations` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`rig_id` varchar(100) NOT NULL,
	`input_channel` int NOT NULL,
	`source` varchar(32) NOT NULL,
	`dbfs_at_one_pascal` double NOT NULL,
	`details` json NOT NULL,
	`notes` varchar(500),
	`valid_from` datetime(3) NOT NULL,
	`valid_until` datetime(3),
	`created_by_label` varchar(200) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `calibrations_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `idempotency_records` (
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`method` varchar(8) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`route_template` varchar(200) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`idempotency_key` varchar(255) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`fingerprint` char(64) NOT NULL,
	`state` varchar(16) NOT NULL,
	`response_status` int,
	`response_headers` json,
	`response_body` longtext,
	`created_at` datetime(3) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	CONSTRAINT `idempotency_records_scope_unique` UNIQUE(`organisation_id`,`method`,`route_template`,`idempotency_key`)
);
--> statement-breakpoint
CREATE TABLE `mask_versions` (
	`mask_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`version` int NOT NULL,
	`level_reference` varchar(16) NOT NULL,
	`reference` json,
	`upper` json,
	`lower` json,
	`derivation` json,
	`note` varchar(500),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `mask_versions_mask_id_version_pk` PRIMARY KEY(`mask_id`,`version`)
);
--> statement-breakpoint
CREATE TABLE `masks` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`name` varchar(100) NOT NULL,
	`latest_version` int NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `masks_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `organisation_plans` (
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`plan_id` varchar(16) NOT NULL,
	`period_anchor` datetime(3) NOT NULL,
	`limit_overrides` json,
	`provider_customer_id` varchar(255),
	`provider_subscription_id` varchar(255),
	`subscription_status` varchar(32),
	`current_period_ends_at` datetime(3),
	`expired_calibration_policy` varchar(8) NOT NULL DEFAULT 'warn',
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `organisation_plans_organisation_id` PRIMARY KEY(`organisation_id`)
);
--> statement-breakpoint
CREATE TABLE `rate_limit_windows` (
	`partition_key` varchar(80) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`window_start` datetime(3) NOT NULL,
	`request_count` int NOT NULL,
	CONSTRAINT `rate_limit_windows_partition_key_window_start_pk` PRIMARY KEY(`partition_key`,`window_start`)
);
--> statement-breakpoint
CREATE TABLE `storage_usage` (
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`storage_bytes` bigint NOT NULL DEFAULT 0,
	CONSTRAINT `storage_usage_organisation_id` PRIMARY KEY(`organisation_id`)
);
--> statement-breakpoint
CREATE TABLE `usage_charges` (
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`analysis_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`period_start` datetime(3) NOT NULL,
	`audio_seconds` double NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `usage_charges_organisation_id_analysis_id_pk` PRIMARY KEY(`organisation_id`,`analysis_id`)
);
--> statement-breakpoint
CREATE TABLE `usage_counters` (
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`period_start` datetime(3) NOT NULL,
	`period_end` datetime(3) NOT NULL,
	`analyses_count` int NOT NULL DEFAULT 0,
	`audio_seconds` double NOT NULL DEFAULT 0,
	CONSTRAINT `usage_counters_organisation_id_period_start_pk` PRIMARY KEY(`organisation_id`,`period_start`)
);
--> statement-breakpoint
CREATE TABLE `usage_threshold_notices` (
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`period_start` datetime(3) NOT NULL,
	`quota` varchar(16) NOT NULL,
	`threshold_percent` int NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`notified_at` datetime(3),
	CONSTRAINT `usage_threshold_notices_unique` UNIQUE(`organisation_id`,`period_start`,`quota`,`threshold_percent`)
);
--> statement-breakpoint
CREATE TABLE `webhook_deliveries` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`endpoint_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`event_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`status` varchar(16) NOT NULL,
	`attempts` int NOT NULL,
	`next_attempt_at` datetime(3),
	`locked_until` datetime(3),
	`last_attempt_at` datetime(3),
	`last_response_status` int,
	`last_response_excerpt` varchar(1024),
	`last_error` varchar(500),
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `webhook_deliveries_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `webhook_delivery_attempts` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`delivery_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`attempt_number` int NOT NULL,
	`outcome` varchar(32) NOT NULL,
	`response_status` int,
	`response_excerpt` varchar(1024),
	`error` json,
	`duration_ms` int NOT NULL,
	`attempted_at` datetime(3) NOT NULL,
	CONSTRAINT `webhook_delivery_attempts_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `webhook_endpoints` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`url` varchar(2048) NOT NULL,
	`description` varchar(200),
	`event_types` json NOT NULL,
	`enabled` boolean NOT NULL,
	`disabled_reason` varchar(32),
	`secret_sealed` varchar(255) NOT NULL,
	`previous_secret_sealed` varchar(255),
	`previous_secret_expires_at` datetime(3),
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `webhook_endpoints_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `webhook_events` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`type` varchar(64) NOT NULL,
	`body` text NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `webhook_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `calibrations` ADD CONSTRAINT `calibrations_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `idempotency_records` ADD CONSTRAINT `idempotency_records_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `mask_versions` ADD CONSTRAINT `mask_versions_mask_id_masks_id_fk` FOREIGN KEY (`mask_id`) REFERENCES `masks`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `mask_versions` ADD CONSTRAINT `mask_versions_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `masks` ADD CONSTRAINT `masks_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `organisation_plans` ADD CONSTRAINT `organisation_plans_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `storage_usage` ADD CONSTRAINT `storage_usage_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `usage_charges` ADD CONSTRAINT `usage_charges_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `usage_counters` ADD CONSTRAINT `usage_counters_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `usage_threshold_notices` ADD CONSTRAINT `usage_threshold_notices_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `webhook_deliveries` ADD CONSTRAINT `webhook_deliveries_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `webhook_deliveries` ADD CONSTRAINT `webhook_deliveries_endpoint_id_webhook_endpoints_id_fk` FOREIGN KEY (`endpoint_id`) REFERENCES `webhook_endpoints`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `webhook_deliveries` ADD CONSTRAINT `webhook_deliveries_event_id_webhook_events_id_fk` FOREIGN KEY (`event_id`) REFERENCES `webhook_events`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `webhook_delivery_attempts` ADD CONSTRAINT `webhook_delivery_attempts_delivery_id_webhook_deliveries_id_fk` FOREIGN KEY (`delivery_id`) REFERENCES `webhook_deliveries`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `webhook_endpoints` ADD CONSTRAINT `webhook_endpoints_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `webhook_events` ADD CONSTRAINT `webhook_events_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `calibrations_organisation_created_idx` ON `calibrations` (`organisation_id`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `calibrations_rig_idx` ON `calibrations` (`organisation_id`,`rig_id`,`input_channel`,`valid_from`);--> statement-breakpoint
CREATE INDEX `idempotency_records_expires_idx` ON `idempotency_records` (`expires_at`);--> statement-breakpoint
CREATE INDEX `masks_organisation_created_idx` ON `masks` (`organisation_id`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `rate_limit_windows_start_idx` ON `rate_limit_windows` (`window_start`);--> statement-breakpoint
CREATE INDEX `webhook_deliveries_due_idx` ON `webhook_deliveries` (`status`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `webhook_deliveries_endpoint_created_idx` ON `webhook_deliveries` (`organisation_id`,`endpoint_id`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `webhook_delivery_attempts_delivery_idx` ON `webhook_delivery_attempts` (`delivery_id`,`attempt_number`);--> statement-breakpoint
CREATE INDEX `webhook_endpoints_organisation_created_idx` ON `webhook_endpoints` (`organisation_id`,`created_at`,`id`);--> statement-breakpoint
CREATE INDEX `webhook_events_organisation_created_idx` ON `webhook_events` (`organisation_id`,`created_at`);