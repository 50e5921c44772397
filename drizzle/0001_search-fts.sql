-- Search (issue 6; why: docs/decisions/006-search-fts5-with-vocabulary.md).
-- search_docs holds one row per searchable thing with the facts results are filtered on; search_fts holds its title
-- and body and search_titles its title alone, under the same rowid. The triggers below keep all three in step with
-- records and calculations inside the transaction of every write, so a search right after a save sees it. Guides
-- are written by the app at start.
-- These tables are not in the Drizzle schema on purpose: drizzle-kit cannot describe FTS5 or triggers.
CREATE TABLE `search_docs` (
	`id` integer PRIMARY KEY,
	`type` text NOT NULL,
	`ref_id` text NOT NULL,
	`subsystem` text NOT NULL,
	`season_id` text,
	`status` text,
	`kind` text
);
--> statement-breakpoint
CREATE UNIQUE INDEX `search_docs_ref` ON `search_docs` (`ref_id`, `type`);
--> statement-breakpoint
-- The typo-correction vocabulary as last built, so a restart has it within a second. search_state.generation counts
-- changes to the index (every trigger below adds one); the saved vocabulary is current when its generation matches.
CREATE TABLE `search_terms` (
	`term` text PRIMARY KEY NOT NULL,
	`docs` integer NOT NULL
) WITHOUT ROWID;
--> statement-breakpoint
CREATE TABLE `search_state` (
	`id` integer PRIMARY KEY NOT NULL CHECK (`id` = 1),
	`generation` integer DEFAULT 0 NOT NULL,
	`terms_generation` integer DEFAULT -1 NOT NULL
);
--> statement-breakpoint
INSERT INTO `search_state` (`id`) VALUES (1);
--> statement-breakpoint
CREATE TABLE `search_meta` (
	`key` text PRIMARY KEY NOT NULL,
	`value` text NOT NULL
);
--> statement-breakpoint
-- Prefix indexes for 2 to 4 characters make the as-you-type prefix of the last word cheap.
CREATE VIRTUAL TABLE `search_fts` USING fts5(title, body, tokenize = 'unicode61 remove_diacritics 2', prefix = '2 3 4');
--> statement-breakpoint
-- Titles alone: a small index that finds "every word in the title" without reading the bodies' word lists.
CREATE VIRTUAL TABLE `search_titles` USING fts5(title, content = '', contentless_delete = 1, tokenize = 'unicode61 remove_diacritics 2', prefix = '2 3 4');
--> statement-breakpoint
-- Every distinct term with its document count: the vocabulary typo correction chooses from.
CREATE VIRTUAL TABLE `search_vocab` USING fts5vocab(`search_fts`, 'row');
--> statement-breakpoint
CREATE TRIGGER `search_records_insert` AFTER INSERT ON `records` WHEN NEW.`deleted_at` IS NULL BEGIN
	UPDATE `search_state` SET `generation` = `generation` + 1 WHERE `id` = 1;
	INSERT INTO `search_docs` (`type`, `ref_id`, `subsystem`, `season_id`, `status`, `kind`)
		VALUES (NEW.`kind`, NEW.`id`, NEW.`subsystem_slug`, NEW.`season_id`, NEW.`status`, NEW.`source`);
	INSERT INTO `search_fts` (`rowid`, `title`, `body`)
		SELECT `id`, NEW.`title`, NEW.`body_text` FROM `search_docs` WHERE `ref_id` = NEW.`id` AND `type` = NEW.`kind`;
	INSERT INTO `search_titles` (`rowid`, `title`)
		SELECT `id`, NEW.`title` FROM `search_docs` WHERE `ref_id` = NEW.`id` AND `type` = NEW.`kind`;
END;
--> statement-breakpoint
CREATE TRIGGER `search_records_update` AFTER UPDATE OF `kind`, `title`, `body_text`, `subsystem_slug`, `season_id`, `status`, `source`, `deleted_at` ON `records` BEGIN
	UPDATE `search_state` SET `generation` = `generation` + 1 WHERE `id` = 1;
	DELETE FROM `search_fts` WHERE `rowid` = (SELECT `id` FROM `search_docs` WHERE `ref_id` = OLD.`id` AND `type` = OLD.`kind`);
	DELETE FROM `search_titles` WHERE `rowid` = (SELECT `id` FROM `search_docs` WHERE `ref_id` = OLD.`id` AND `type` = OLD.`kind`);
	DELETE FROM `search_docs` WHERE `ref_id` = OLD.`id` AND `type` = OLD.`kind`;
	INSERT INTO `search_docs` (`type`, `ref_id`, `subsystem`, `season_id`, `status`, `kind`)
		SELECT NEW.`kind`, NEW.`id`, NEW.`subsystem_slug`, NEW.`season_id`, NEW.`status`, NEW.`source` WHERE NEW.`deleted_at` IS NULL;
	INSERT INTO `search_fts` (`rowid`, `title`, `body`)
		SELECT `id`, NEW.`title`, NEW.`body_text` FROM `search_docs` WHERE `ref_id` = NEW.`id` AND `type` = NEW.`kind`;
	INSERT INTO `search_titles` (`rowid`, `title`)
		SELECT `id`, NEW.`title` FROM `search_docs` WHERE `ref_id` = NEW.`id` AND `type` = NEW.`kind`;
END;
--> statement-breakpoint
CREATE TRIGGER `search_records_delete` AFTER DELETE ON `records` BEGIN
	UPDATE `search_state` SET `generation` = `generation` + 1 WHERE `id` = 1;
	DELETE FROM `search_fts` WHERE `rowid` = (SELECT `id` FROM `search_docs` WHERE `ref_id` = OLD.`id` AND `type` = OLD.`kind`);
	DELETE FROM `search_titles` WHERE `rowid` = (SELECT `id` FROM `search_docs` WHERE `ref_id` = OLD.`id` AND `type` = OLD.`kind`);
	DELETE FROM `search_docs` WHERE `ref_id` = OLD.`id` AND `type` = OLD.`kind`;
END;
--> statement-breakpoint
-- A calculation's words: title; notes, calculator kind, the names of its inputs and their text values (numbers are
-- left out: they would match every query for "2" or "0").
CREATE TRIGGER `search_calculations_insert` AFTER INSERT ON `calculations` WHEN NEW.`deleted_at` IS NULL BEGIN
	UPDATE `search_state` SET `generation` = `generation` + 1 WHERE `id` = 1;
	INSERT INTO `search_docs` (`type`, `ref_id`, `subsystem`, `season_id`, `status`, `kind`)
		VALUES ('calculation', NEW.`id`, NEW.`subsystem_slug`, NEW.`season_id`, NULL, NEW.`kind`);
	INSERT INTO `search_fts` (`rowid`, `title`, `body`)
		SELECT `id`, NEW.`title`,
			NEW.`notes` || ' ' || NEW.`kind` || ' ' || CASE WHEN json_valid(NEW.`inputs`) THEN coalesce((SELECT group_concat(`key` || CASE WHEN `type` = 'text' THEN ' ' || `value` ELSE '' END, ' ') FROM json_each(NEW.`inputs`)), '') ELSE '' END
		FROM `search_docs` WHERE `ref_id` = NEW.`id` AND `type` = 'calculation';
	INSERT INTO `search_titles` (`rowid`, `title`)
		SELECT `id`, NEW.`title` FROM `search_docs` WHERE `ref_id` = NEW.`id` AND `type` = 'calculation';
END;
--> statement-breakpoint
CREATE TRIGGER `search_calculations_update` AFTER UPDATE OF `kind`, `title`, `notes`, `inputs`, `subsystem_slug`, `season_id`, `deleted_at` ON `calculations` BEGIN
	UPDATE `search_state` SET `generation` = `generation` + 1 WHERE `id` = 1;
	DELETE FROM `search_fts` WHERE `rowid` = (SELECT `id` FROM `search_docs` WHERE `ref_id` = OLD.`id` AND `type` = 'calculation');
	DELETE FROM `search_titles` WHERE `rowid` = (SELECT `id` FROM `search_docs` WHERE `ref_id` = OLD.`id` AND `type` = 'calculation');
	DELETE FROM `search_docs` WHERE `ref_id` = OLD.`id` AND `type` = 'calculation';
	INSERT INTO `search_docs` (`type`, `ref_id`, `subsystem`, `season_id`, `status`, `kind`)
		SELECT 'calculation', NEW.`id`, NEW.`subsystem_slug`, NEW.`season_id`, NULL, NEW.`kind` WHERE NEW.`deleted_at` IS NULL;
	INSERT INTO `search_fts` (`rowid`, `title`, `body`)
		SELECT `id`, NEW.`title`,
			NEW.`notes` || ' ' || NEW.`kind` || ' ' || CASE WHEN json_valid(NEW.`inputs`) THEN coalesce((SELECT group_concat(`key` || CASE WHEN `type` = 'text' THEN ' ' || `value` ELSE '' END, ' ') FROM json_each(NEW.`inputs`)), '') ELSE '' END
		FROM `search_docs` WHERE `ref_id` = NEW.`id` AND `type` = 'calculation';
	INSERT INTO `search_titles` (`rowid`, `title`)
		SELECT `id`, NEW.`title` FROM `search_docs` WHERE `ref_id` = NEW.`id` AND `type` = 'calculation';
END;
--> statement-breakpoint
CREATE TRIGGER `search_calculations_delete` AFTER DELETE ON `calculations` BEGIN
	UPDATE `search_state` SET `generation` = `generation` + 1 WHERE `id` = 1;
	DELETE FROM `search_fts` WHERE `rowid` = (SELECT `id` FROM `search_docs` WHERE `ref_id` = OLD.`id` AND `type` = 'calculation');
	DELETE FROM `search_titles` WHERE `rowid` = (SELECT `id` FROM `search_docs` WHERE `ref_id` = OLD.`id` AND `type` = 'calculation');
	DELETE FROM `search_docs` WHERE `ref_id` = OLD.`id` AND `type` = 'calculation';
END;
--> statement-breakpoint
-- Databases that already hold records and calculations get them indexed now.
INSERT INTO `search_docs` (`type`, `ref_id`, `subsystem`, `season_id`, `status`, `kind`)
	SELECT `kind`, `id`, `subsystem_slug`, `season_id`, `status`, `source` FROM `records` WHERE `deleted_at` IS NULL;
--> statement-breakpoint
INSERT INTO `search_fts` (`rowid`, `title`, `body`)
	SELECT d.`id`, r.`title`, r.`body_text` FROM `records` r JOIN `search_docs` d ON d.`ref_id` = r.`id` AND d.`type` = r.`kind`;
--> statement-breakpoint
INSERT INTO `search_docs` (`type`, `ref_id`, `subsystem`, `season_id`, `status`, `kind`)
	SELECT 'calculation', `id`, `subsystem_slug`, `season_id`, NULL, `kind` FROM `calculations` WHERE `deleted_at` IS NULL;
--> statement-breakpoint
INSERT INTO `search_fts` (`rowid`, `title`, `body`)
	SELECT d.`id`, c.`title`,
		c.`notes` || ' ' || c.`kind` || ' ' || CASE WHEN json_valid(c.`inputs`) THEN coalesce((SELECT group_concat(`key` || CASE WHEN `type` = 'text' THEN ' ' || `value` ELSE '' END, ' ') FROM json_each(c.`inputs`)), '') ELSE '' END
	FROM `calculations` c JOIN `search_docs` d ON d.`ref_id` = c.`id` AND d.`type` = 'calculation';
--> statement-breakpoint
INSERT INTO `search_titles` (`rowid`, `title`) SELECT `rowid`, `title` FROM `search_fts`;
