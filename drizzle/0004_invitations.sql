CREATE TABLE `invitations` (
	`id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`organisation_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
	`email` varchar(254) NOT NULL,
	`role` enum('owner','admin','analyst','viewer') NOT NULL,
	`status` enum('pending','accepted','revoked','expired') NOT NULL,
	`pending_email` varchar(254),
	`token_hash` char(64) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`invited_by_label` varchar(100) NOT NULL,
	`invited_by_user_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin,
	`email_status` enum('sent','failed','not_sent') NOT NULL,
	`email_error` varchar(500),
	`last_sent_at` datetime(3) NOT NULL,
	`send_count` int NOT NULL,
	`accepted_by_user_id` varchar(32) CHARACTER SET ascii COLLATE ascii_bin,
	`accepted_at` datetime(3),
	`revoked_at` datetime(3),
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `invitations_id` PRIMARY KEY(`id`),
	CONSTRAINT `invitations_token_hash_unique` UNIQUE(`token_hash`),
	CONSTRAINT `invitations_pending_email_unique` UNIQUE(`organisation_id`,`pending_email`)
);
--> statement-breakpoint
ALTER TABLE `invitations` ADD CONSTRAINT `invitations_organisation_id_organisations_id_fk` FOREIGN KEY (`organisation_id`) REFERENCES `organisations`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `invitations` ADD CONSTRAINT `invitations_invited_by_user_id_users_id_fk` FOREIGN KEY (`invited_by_user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `invitations` ADD CONSTRAINT `invitations_accepted_by_user_id_users_id_fk` FOREIGN KEY (`accepted_by_user_id`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `invitations_organisation_created_idx` ON `invitations` (`organisation_id`,`created_at`,`id`);