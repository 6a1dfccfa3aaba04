/**
 * Carriers the workshop ships with, by name, for the shipping form's suggestions. Their public
 * tracking pages are built on the server (`$lib/server/orders/tracking`), so the browser bundle
 * holds no outside address. A carrier not listed is still accepted (a local courier).
 */
export const CARRIER_NAMES = ['USPS', 'UPS', 'FedEx', 'DHL', 'Royal Mail', 'Canada Post'] as const;
