-- Public pages show these tables; each write bumps the counter in the writer's own transaction
-- (page cache, src/lib/server/catalogue-cache.ts). Orders and their history are not counted.
INSERT INTO `catalogue_version` (`id`, `n`) VALUES (1, 1);
--> statement-breakpoint
CREATE TRIGGER `cv_pieces_insert` AFTER INSERT ON `pieces` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_pieces_update` AFTER UPDATE ON `pieces` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_pieces_delete` AFTER DELETE ON `pieces` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_piece_woods_insert` AFTER INSERT ON `piece_woods` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_piece_woods_update` AFTER UPDATE ON `piece_woods` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_piece_woods_delete` AFTER DELETE ON `piece_woods` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_photos_insert` AFTER INSERT ON `photos` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_photos_update` AFTER UPDATE ON `photos` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_photos_delete` AFTER DELETE ON `photos` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_stock_insert` AFTER INSERT ON `stock` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_stock_update` AFTER UPDATE ON `stock` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_stock_delete` AFTER DELETE ON `stock` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_woods_insert` AFTER INSERT ON `woods` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_woods_update` AFTER UPDATE ON `woods` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_woods_delete` AFTER DELETE ON `woods` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_settings_insert` AFTER INSERT ON `settings` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_settings_update` AFTER UPDATE ON `settings` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_settings_delete` AFTER DELETE ON `settings` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_fairs_insert` AFTER INSERT ON `fairs` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_fairs_update` AFTER UPDATE ON `fairs` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_fairs_delete` AFTER DELETE ON `fairs` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_shipping_rates_insert` AFTER INSERT ON `shipping_rates` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_shipping_rates_update` AFTER UPDATE ON `shipping_rates` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
--> statement-breakpoint
CREATE TRIGGER `cv_shipping_rates_delete` AFTER DELETE ON `shipping_rates` FOR EACH ROW UPDATE `catalogue_version` SET `n` = `n` + 1 WHERE `id` = 1;
