import {
	mysqlTable,
	varchar,
	int,
	boolean,
	datetime,
	date,
	text,
	mysqlEnum,
	primaryKey,
	uniqueIndex,
	index,
	bigint,
	tinyint
} from 'drizzle-orm/mysql-core';
import { json } from './json';
import { orderStatuses, type OrderStatus } from '$lib/orders/status';
import { balanceMethods } from '$lib/orders/balance';
import { pieceKinds } from '$lib/catalogue/kinds';
import type { Personalisation, PiecePattern } from '../../pattern/snapshot';

export const roles = ['owner', 'helper', 'customer'] as const;
export type Role = (typeof roles)[number];

export const users = mysqlTable('users', {
	id: varchar('id', { length: 36 }).primaryKey(),
	email: varchar('email', { length: 255 }).notNull().unique(),
	name: varchar('name', { length: 120 }).notNull(),
	passwordHash: varchar('password_hash', { length: 255 }).notNull(),
	role: mysqlEnum('role', roles).notNull().default('customer'),
	createdAt: datetime('created_at').notNull(),
	/**
	 * When the owner of the address opened a link we e-mailed to it (the sign-up link, a reset
	 * link). Null for accounts made without one: guest orders gather into an account only once
	 * its address is proven.
	 */
	emailConfirmedAt: datetime('email_confirmed_at')
});

/** Session id is the SHA-256 hex of the cookie token; the token itself is never stored. */
export const sessions = mysqlTable('sessions', {
	id: varchar('id', { length: 64 }).primaryKey(),
	userId: varchar('user_id', { length: 36 })
		.notNull()
		.references(() => users.id, { onDelete: 'cascade' }),
	expiresAt: datetime('expires_at').notNull()
});

/** Single-use reset tokens, stored hashed like sessions. */
export const passwordResets = mysqlTable('password_resets', {
	id: varchar('id', { length: 64 }).primaryKey(),
	userId: varchar('user_id', { length: 36 })
		.notNull()
		.references(() => users.id, { onDelete: 'cascade' }),
	expiresAt: datetime('expires_at').notNull(),
	usedAt: datetime('used_at')
});

/**
 * A sign-up waiting for its e-mail link. The account is made only when the link is opened, so
 * the sign-up form answers the same for a new and a known address (the token is stored hashed).
 */
export const pendingSignups = mysqlTable('pending_signups', {
	id: varchar('id', { length: 64 }).primaryKey(),
	email: varchar('email', { length: 255 }).notNull(),
	name: varchar('name', { length: 120 }).notNull(),
	passwordHash: varchar('password_hash', { length: 255 }).notNull(),
	expiresAt: datetime('expires_at').notNull()
});

/**
 * Counters of rate-limiter-flexible's MySQL store (its own column layout), shared by every app
 * process so a limit holds however many processes serve the shop.
 */
export const rateLimits = mysqlTable('rate_limits', {
	key: varchar('key', { length: 255 }).primaryKey(),
	points: int('points').notNull().default(0),
	expire: bigint('expire', { mode: 'number', unsigned: true })
});

export const woods = mysqlTable('woods', {
	id: int('id').autoincrement().primaryKey(),
	slug: varchar('slug', { length: 40 }).notNull().unique(),
	name: varchar('name', { length: 80 }).notNull(),
	botanicalName: varchar('botanical_name', { length: 120 }).notNull(),
	/** Specific gravity at 12 % MC, in thousandths (0.37 → 370). */
	specificGravityMilli: int('specific_gravity_milli').notNull(),
	densityKgM3: int('density_kg_m3').notNull(),
	sideHardnessN: int('side_hardness_n').notNull(),
	priceAddOnMinor: int('price_add_on_minor').notNull().default(0),
	toneLight: varchar('tone_light', { length: 7 }).notNull(),
	toneDark: varchar('tone_dark', { length: 7 }).notNull(),
	character: varchar('character', { length: 255 }).notNull(),
	caution: text('caution')
});

export const pieces = mysqlTable('pieces', {
	id: int('id').autoincrement().primaryKey(),
	slug: varchar('slug', { length: 80 }).notNull().unique(),
	title: varchar('title', { length: 120 }).notNull(),
	kind: mysqlEnum('kind', pieceKinds).notNull(),
	summary: varchar('summary', { length: 255 }).notNull(),
	description: text('description').notNull(),
	lengthMm: int('length_mm').notNull(),
	widthMm: int('width_mm').notNull(),
	thicknessMm: int('thickness_mm').notNull(),
	basePriceMinor: int('base_price_minor').notNull(),
	currency: varchar('currency', { length: 3 }).notNull().default('USD'),
	personalisable: boolean('personalisable').notNull().default(false),
	foodContact: boolean('food_contact').notNull().default(false),
	leadDays: int('lead_days').notNull().default(14),
	/** Default rosette layout for this piece: { diameterMm, count, spacingMm, split }. */
	pattern: json('pattern').$type<PiecePattern>().notNull(),
	active: boolean('active').notNull().default(true),
	/** How to look after the piece, shown on its page (finish, cleaning, food contact). */
	careNotes: text('care_notes'),
	createdAt: datetime('created_at').notNull()
});

/** Which woods a piece can be made in. */
export const pieceWoods = mysqlTable(
	'piece_woods',
	{
		pieceId: int('piece_id')
			.notNull()
			.references(() => pieces.id, { onDelete: 'cascade' }),
		woodId: int('wood_id')
			.notNull()
			.references(() => woods.id)
	},
	(t) => [primaryKey({ columns: [t.pieceId, t.woodId] })]
);

export const photos = mysqlTable('photos', {
	id: int('id').autoincrement().primaryKey(),
	pieceId: int('piece_id')
		.notNull()
		.references(() => pieces.id, { onDelete: 'cascade' }),
	/** Object key prefix in the photo bucket; variants live at `${key}/${width}.webp`. */
	storageKey: varchar('storage_key', { length: 200 }).notNull(),
	alt: varchar('alt', { length: 200 }).notNull(),
	position: int('position').notNull().default(0),
	width: int('width').notNull(),
	height: int('height').notNull()
});

/** The stock place of the workshop shelf; fairs use 'fair:<id>'. */
export const WORKSHOP = 'workshop';

/** Finished pieces on hand per piece × wood × place ('workshop' or 'fair:<id>'). */
export const stock = mysqlTable(
	'stock',
	{
		id: int('id').autoincrement().primaryKey(),
		pieceId: int('piece_id')
			.notNull()
			.references(() => pieces.id, { onDelete: 'cascade' }),
		woodId: int('wood_id')
			.notNull()
			.references(() => woods.id),
		place: varchar('place', { length: 40 }).notNull().default('workshop'),
		quantity: int('quantity').notNull().default(0)
	},
	(t) => [uniqueIndex('stock_piece_wood_place').on(t.pieceId, t.woodId, t.place)]
);

export const carts = mysqlTable('carts', {
	id: varchar('id', { length: 36 }).primaryKey(),
	userId: varchar('user_id', { length: 36 }).references(() => users.id, { onDelete: 'set null' }),
	destination: varchar('destination', { length: 2 }),
	createdAt: datetime('created_at').notNull(),
	updatedAt: datetime('updated_at').notNull()
});

/**
 * The buyer's name, e-mail and address as last sent from this basket's checkout, so a declined
 * card or a cancelled payment page brings the form back filled. Personal data: it lives only as
 * long as the basket (deleted with it, when the order is paid, and by the sweep once the basket
 * has lain untouched as long as its cookie lasts).
 */
export const checkoutDetails = mysqlTable('checkout_details', {
	cartId: varchar('cart_id', { length: 36 })
		.primaryKey()
		.references(() => carts.id, { onDelete: 'cascade' }),
	name: varchar('name', { length: 120 }).notNull(),
	email: varchar('email', { length: 255 }).notNull(),
	address: json('address').$type<Address>().notNull(),
	giftNote: varchar('gift_note', { length: 500 }),
	savedAt: datetime('saved_at').notNull()
});

export const cartLines = mysqlTable('cart_lines', {
	id: int('id').autoincrement().primaryKey(),
	cartId: varchar('cart_id', { length: 36 })
		.notNull()
		.references(() => carts.id, { onDelete: 'cascade' }),
	pieceId: int('piece_id')
		.notNull()
		.references(() => pieces.id),
	woodId: int('wood_id')
		.notNull()
		.references(() => woods.id),
	quantity: int('quantity').notNull().default(1),
	/** Snapshot of the personaliser inputs, recomputed by the server. */
	personalisation: json('personalisation').$type<Personalisation>(),
	createdAt: datetime('created_at').notNull()
});

// The status list and its allowed moves live in one pure module the browser can import too.
export { orderStatuses, type OrderStatus };
// One personalisation type, beside the engine that reads it.
export type { Personalisation, PiecePattern };

export type Address = {
	line1: string;
	line2?: string;
	city: string;
	region?: string;
	postcode: string;
	country: string;
};

export const orders = mysqlTable(
	'orders',
	{
		id: int('id').autoincrement().primaryKey(),
		ref: varchar('ref', { length: 16 }).notNull().unique(),
		userId: varchar('user_id', { length: 36 }).references(() => users.id, {
			onDelete: 'set null'
		}),
		cartId: varchar('cart_id', { length: 36 }),
		email: varchar('email', { length: 255 }).notNull(),
		buyerName: varchar('buyer_name', { length: 120 }).notNull(),
		address: json('address').$type<Address>().notNull(),
		giftNote: varchar('gift_note', { length: 500 }),
		currency: varchar('currency', { length: 3 }).notNull(),
		subtotalMinor: int('subtotal_minor').notNull(),
		shippingMinor: int('shipping_minor').notNull(),
		taxMinor: int('tax_minor').notNull().default(0),
		totalMinor: int('total_minor').notNull(),
		status: mysqlEnum('status', orderStatuses).notNull().default('pending'),
		checkoutSessionId: varchar('checkout_session_id', { length: 255 }),
		paymentIntentId: varchar('payment_intent_id', { length: 255 }),
		/** Part paid up front (a booth order's deposit); the rest is due before it ships. */
		depositMinor: int('deposit_minor'),
		/** When the rest after a deposit was paid, and how; null while it is still owed. */
		balancePaidAt: datetime('balance_paid_at'),
		balanceMethod: mysqlEnum('balance_method', balanceMethods),
		/** A booth order: the buyer collects it, or it is posted (shipping charged by the rates). */
		delivery: mysqlEnum('delivery', ['post', 'collect']),
		refundedMinor: int('refunded_minor').notNull().default(0),
		/** The workshop's plan from the carving queue; moves as the queue moves. */
		readyBy: date('ready_by', { mode: 'string' }),
		/** The day the buyer was told when it was paid; kept (see promiseReadyBy). */
		promisedBy: date('promised_by', { mode: 'string' }),
		holdExpiresAt: datetime('hold_expires_at'),
		createdAt: datetime('created_at').notNull(),
		paidAt: datetime('paid_at')
	},
	(t) => [index('orders_status').on(t.status), index('orders_session').on(t.checkoutSessionId)]
);

export const orderLines = mysqlTable('order_lines', {
	id: int('id').autoincrement().primaryKey(),
	orderId: int('order_id')
		.notNull()
		.references(() => orders.id, { onDelete: 'cascade' }),
	pieceId: int('piece_id')
		.notNull()
		.references(() => pieces.id),
	woodId: int('wood_id')
		.notNull()
		.references(() => woods.id),
	title: varchar('title', { length: 120 }).notNull(),
	woodName: varchar('wood_name', { length: 80 }).notNull(),
	quantity: int('quantity').notNull(),
	unitPriceMinor: int('unit_price_minor').notNull(),
	lineTotalMinor: int('line_total_minor').notNull(),
	/** Taken from workshop stock (held, then sold) rather than made to order. */
	fromStock: boolean('from_stock').notNull().default(false),
	personalisation: json('personalisation').$type<Personalisation>()
});

export const shipments = mysqlTable('shipments', {
	id: int('id').autoincrement().primaryKey(),
	orderId: int('order_id')
		.notNull()
		.references(() => orders.id, { onDelete: 'cascade' }),
	carrier: varchar('carrier', { length: 60 }).notNull(),
	trackingNumber: varchar('tracking_number', { length: 80 }).notNull(),
	shippedAt: datetime('shipped_at').notNull()
});

/** Shipping rate table: price for parcels up to a weight in a destination zone. */
export const shippingRates = mysqlTable('shipping_rates', {
	id: int('id').autoincrement().primaryKey(),
	zone: varchar('zone', { length: 20 }).notNull(),
	upToGrams: int('up_to_grams').notNull(),
	priceMinor: int('price_minor').notNull()
});

/** Owner settings as small JSON values keyed by name (sales tax, effort model, shop name). */
export const settings = mysqlTable('settings', {
	key: varchar('key', { length: 60 }).primaryKey(),
	value: json('value').notNull()
});

/**
 * One row counting writes to what public pages show (catalogue, settings, fairs, shipping
 * rates): database triggers bump it in the writer's own transaction (drizzle/0010, custom
 * SQL), so the page cache learns of any change by reading one row. Orders are not counted.
 */
export const catalogueVersion = mysqlTable('catalogue_version', {
	id: tinyint('id').primaryKey(),
	n: bigint('n', { mode: 'number', unsigned: true }).notNull().default(0)
});

export const fairs = mysqlTable('fairs', {
	id: int('id').autoincrement().primaryKey(),
	name: varchar('name', { length: 120 }).notNull(),
	place: varchar('place', { length: 160 }).notNull(),
	startsOn: date('starts_on', { mode: 'string' }).notNull(),
	endsOn: date('ends_on', { mode: 'string' }).notNull(),
	currency: varchar('currency', { length: 3 }).notNull().default('USD'),
	boothFeeMinor: int('booth_fee_minor').notNull().default(0),
	/** Sales-tax rate in basis points (7.65 % → 765). */
	salesTaxBp: int('sales_tax_bp').notNull().default(0),
	cashFloatMinor: int('cash_float_minor').notNull().default(0),
	notes: text('notes'),
	/** Costs besides the booth fee (travel, table hire, lunch for the helper), one sum. */
	otherCostsMinor: int('other_costs_minor').notNull().default(0),
	/** Whether the price tags already hold the sales tax (tax is then taken out, not added). */
	pricesIncludeTax: boolean('prices_include_tax').notNull().default(false),
	/** Card reader's fee on each card sale, basis points (2.6 % → 260). */
	cardFeeBp: int('card_fee_bp').notNull().default(0),
	/** Largest discount a helper may give on one sale, basis points of its subtotal. */
	helperDiscountBp: int('helper_discount_bp').notNull().default(1000),
	/** Hours the booth was open over the whole fair, in minutes (for net per hour). */
	openMinutes: int('open_minutes').notNull().default(480),
	/** Set once when the fair is closed and unsold pieces went back to the workshop. */
	closedAt: datetime('closed_at')
});

export const fairStock = mysqlTable(
	'fair_stock',
	{
		id: int('id').autoincrement().primaryKey(),
		fairId: int('fair_id')
			.notNull()
			.references(() => fairs.id, { onDelete: 'cascade' }),
		pieceId: int('piece_id')
			.notNull()
			.references(() => pieces.id),
		woodId: int('wood_id')
			.notNull()
			.references(() => woods.id),
		loadedOut: int('loaded_out').notNull().default(0),
		countedBack: int('counted_back'),
		/** Pieces sent back to the workshop when the fair was closed. */
		returned: int('returned')
	},
	(t) => [uniqueIndex('fair_stock_line').on(t.fairId, t.pieceId, t.woodId)]
);

export const paymentMethods = ['cash', 'card', 'other'] as const;
export type PaymentMethod = (typeof paymentMethods)[number];
export const boothEntryKinds = ['sale', 'deposit'] as const;

export const boothSales = mysqlTable('booth_sales', {
	/** Generated on the phone so a sale synced twice is stored once. */
	id: varchar('id', { length: 36 }).primaryKey(),
	fairId: int('fair_id')
		.notNull()
		.references(() => fairs.id, { onDelete: 'cascade' }),
	method: mysqlEnum('method', paymentMethods).notNull(),
	lines: json('lines')
		.$type<{ pieceId: number; woodId: number; quantity: number; unitPriceMinor: number }[]>()
		.notNull(),
	subtotalMinor: int('subtotal_minor').notNull(),
	taxMinor: int('tax_minor').notNull().default(0),
	totalMinor: int('total_minor').notNull(),
	soldAt: datetime('sold_at').notNull(),
	recordedBy: varchar('recorded_by', { length: 36 }).references(() => users.id, {
		onDelete: 'set null'
	}),
	/** 'deposit': money taken at the booth towards a personalised order (orderId set, no lines). */
	kind: mysqlEnum('kind', boothEntryKinds).notNull().default('sale'),
	orderId: int('order_id').references(() => orders.id, { onDelete: 'set null' }),
	discountMinor: int('discount_minor').notNull().default(0),
	tenderedMinor: int('tendered_minor'),
	/** Sold more than the fair's stock showed: stored anyway (the buyer has the piece), checked at the tally. */
	flagged: boolean('flagged').notNull().default(false),
	receivedAt: datetime('received_at'),
	/** Made before the close, received after it: counted, and shown as late. */
	late: boolean('late').notNull().default(false),
	/** SHA-256 of what the phone sent, so the same id with other content is a conflict. */
	contentHash: varchar('content_hash', { length: 64 }),
	/** Part of a cash sale paid by card (a split payment); null when paid one way. */
	cardPartMinor: int('card_part_minor'),
	/** Where the buyer asked for a receipt. */
	receiptEmail: varchar('receipt_email', { length: 255 }),
	/** Voided, never deleted: out of takings, tax and method totals; stock put back. */
	voidedAt: datetime('voided_at'),
	voidedBy: varchar('voided_by', { length: 36 }).references(() => users.id, {
		onDelete: 'set null'
	}),
	voidReason: varchar('void_reason', { length: 300 }),
	/** The phone's id for the void, so a resent void is stored once. */
	voidId: varchar('void_id', { length: 36 }).unique()
});

/** Entries the server refused and a helper discarded on the phone: kept for the owner to see. */
export const boothDiscards = mysqlTable('booth_discards', {
	id: varchar('id', { length: 36 }).primaryKey(),
	fairId: int('fair_id')
		.notNull()
		.references(() => fairs.id, { onDelete: 'cascade' }),
	kind: mysqlEnum('kind', boothEntryKinds).notNull(),
	/** What it was, in words: buyer, pieces, amount. */
	summary: varchar('summary', { length: 500 }).notNull(),
	reason: varchar('reason', { length: 500 }).notNull(),
	discardedBy: varchar('discarded_by', { length: 36 }).references(() => users.id, {
		onDelete: 'set null'
	}),
	discardedAt: datetime('discarded_at').notNull()
});

export const tallies = mysqlTable(
	'tallies',
	{
		id: int('id').autoincrement().primaryKey(),
		fairId: int('fair_id')
			.notNull()
			.references(() => fairs.id, { onDelete: 'cascade' }),
		day: date('day', { mode: 'string' }).notNull(),
		cashCountedMinor: int('cash_counted_minor'),
		cardReportedMinor: int('card_reported_minor'),
		/** Cash taken out of the box during the fair (change run, lunch), entered at the tally. */
		cashPaidOutMinor: int('cash_paid_out_minor').notNull().default(0),
		createdBy: varchar('created_by', { length: 36 }).references(() => users.id, {
			onDelete: 'set null'
		}),
		createdAt: datetime('created_at').notNull(),
		/** The first cash count of the day, kept when the helper counts again (one recount allowed). */
		firstCashCountedMinor: int('first_cash_counted_minor'),
		/** How many times the day's count was saved (1 = counted once, 2 = counted again). */
		counts: int('counts').notNull().default(1),
		/** The phone-made id of the last save, so a count resent from the phone's queue is stored once. */
		lastSaveId: varchar('last_save_id', { length: 36 })
	},
	// One cash-up per fair per day.
	(t) => [uniqueIndex('tallies_fair_day').on(t.fairId, t.day)]
);

/** Pieces counted at a day's cash-up, one row per load-out line (the blind count of that day). */
export const tallyCounts = mysqlTable(
	'tally_counts',
	{
		tallyId: int('tally_id')
			.notNull()
			.references(() => tallies.id, { onDelete: 'cascade' }),
		fairStockId: int('fair_stock_id')
			.notNull()
			.references(() => fairStock.id, { onDelete: 'cascade' }),
		counted: int('counted').notNull()
	},
	(t) => [primaryKey({ columns: [t.tallyId, t.fairStockId] })]
);

/** Who sells at a fair: the owner names them; any other helper is refused its booth and tally. */
export const fairHelpers = mysqlTable(
	'fair_helpers',
	{
		fairId: int('fair_id')
			.notNull()
			.references(() => fairs.id, { onDelete: 'cascade' }),
		userId: varchar('user_id', { length: 36 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		addedAt: datetime('added_at').notNull()
	},
	(t) => [primaryKey({ columns: [t.fairId, t.userId] })]
);

/** Every status change of an order: from, to, who (null for the payment server or a sweep), why. */
export const orderHistory = mysqlTable(
	'order_history',
	{
		id: int('id').autoincrement().primaryKey(),
		orderId: int('order_id')
			.notNull()
			.references(() => orders.id, { onDelete: 'cascade' }),
		fromStatus: mysqlEnum('from_status', orderStatuses).notNull(),
		toStatus: mysqlEnum('to_status', orderStatuses).notNull(),
		userId: varchar('user_id', { length: 36 }).references(() => users.id, { onDelete: 'set null' }),
		reason: varchar('reason', { length: 500 }).notNull(),
		createdAt: datetime('created_at').notNull()
	},
	(t) => [index('order_history_order').on(t.orderId, t.id)]
);

/** Every change of stock, with who and why; `stock.quantity` is the running sum. */
export const stockAdjustments = mysqlTable(
	'stock_adjustments',
	{
		id: int('id').autoincrement().primaryKey(),
		pieceId: int('piece_id')
			.notNull()
			.references(() => pieces.id, { onDelete: 'cascade' }),
		woodId: int('wood_id')
			.notNull()
			.references(() => woods.id),
		place: varchar('place', { length: 40 }).notNull(),
		delta: int('delta').notNull(),
		reason: varchar('reason', { length: 160 }).notNull(),
		userId: varchar('user_id', { length: 36 }).references(() => users.id, { onDelete: 'set null' }),
		createdAt: datetime('created_at').notNull()
	},
	(t) => [index('stock_adjustments_piece').on(t.pieceId, t.createdAt)]
);

export const processedEvents = mysqlTable('processed_events', {
	id: varchar('id', { length: 255 }).primaryKey(),
	type: varchar('type', { length: 100 }).notNull(),
	processedAt: datetime('processed_at').notNull()
});

export type User = typeof users.$inferSelect;
export type PublicUser = Omit<User, 'passwordHash'>;

/**
 * Mail waiting to go out. Every message is written here before it is sent, so an SMTP server
 * that is down loses nothing; a drainer claims rows (claimedBy/claimedUntil) so two app
 * processes never send the same row.
 */
export const outbox = mysqlTable(
	'outbox',
	{
		id: int('id').autoincrement().primaryKey(),
		recipients: varchar('recipients', { length: 1000 }).notNull(),
		subject: varchar('subject', { length: 300 }).notNull(),
		textBody: text('text_body').notNull(),
		htmlBody: text('html_body'),
		replyTo: varchar('reply_to', { length: 255 }),
		/** 'failed': given up (a permanent refusal, or temporary failures past the limit). */
		status: mysqlEnum('status', ['pending', 'sent', 'failed']).notNull().default('pending'),
		attempts: int('attempts').notNull().default(0),
		lastError: varchar('last_error', { length: 500 }),
		claimedBy: varchar('claimed_by', { length: 64 }),
		claimedUntil: datetime('claimed_until'),
		messageId: varchar('message_id', { length: 255 }),
		createdAt: datetime('created_at').notNull(),
		sentAt: datetime('sent_at'),
		/** When the outbox gave up on it. */
		failedAt: datetime('failed_at'),
		/** When the owner asked for another try: the retry limit counts from here, not createdAt. */
		retriedAt: datetime('retried_at')
	},
	(t) => [index('outbox_status_idx').on(t.status, t.claimedUntil)]
);

/**
 * One row per run of a job that must happen once per interval across all app processes (the hold
 * sweeper). A process claims an interval by inserting its row: the unique (name, turn) key lets
 * exactly one insert win, on one server or on every node of a cluster.
 */
export const jobRuns = mysqlTable(
	'job_runs',
	{
		id: int('id').autoincrement().primaryKey(),
		name: varchar('name', { length: 64 }).notNull(),
		ranAt: datetime('ran_at', { fsp: 3 }).notNull(),
		/** Which process ran it ("host:pid"), for the record. */
		ranBy: varchar('ran_by', { length: 120 }).notNull(),
		/** What the run did, e.g. orders released. */
		count: int('count').notNull().default(0),
		/** Which interval this run claimed: the database clock's milliseconds ÷ the interval. */
		turn: bigint('turn', { mode: 'number' })
	},
	(t) => [
		index('job_runs_name_ran_at').on(t.name, t.ranAt),
		uniqueIndex('job_runs_name_turn').on(t.name, t.turn)
	]
);

export const refundStatuses = ['pending', 'succeeded', 'failed', 'canceled'] as const;

/**
 * Money given back on an order. A row is written `pending` before the payment server is asked
 * (so two refunds at once cannot together pass what was paid), then carries the provider's id
 * and status; `refund.updated` events keep the status current.
 */
export const orderRefunds = mysqlTable(
	'order_refunds',
	{
		id: int('id').autoincrement().primaryKey(),
		orderId: int('order_id')
			.notNull()
			.references(() => orders.id, { onDelete: 'cascade' }),
		providerRefundId: varchar('provider_refund_id', { length: 255 }),
		amountMinor: int('amount_minor').notNull(),
		reason: varchar('reason', { length: 500 }).notNull(),
		status: mysqlEnum('status', refundStatuses).notNull().default('pending'),
		/** The owner said the piece came back, so it went back on the workshop shelf. */
		restocked: boolean('restocked').notNull().default(false),
		createdBy: varchar('created_by', { length: 36 }).references(() => users.id, {
			onDelete: 'set null'
		}),
		createdAt: datetime('created_at').notNull()
	},
	(t) => [
		uniqueIndex('order_refunds_provider').on(t.providerRefundId),
		index('order_refunds_order').on(t.orderId)
	]
);

/** The workshop's own notes on an order; never shown to the buyer. */
export const orderNotes = mysqlTable(
	'order_notes',
	{
		id: int('id').autoincrement().primaryKey(),
		orderId: int('order_id')
			.notNull()
			.references(() => orders.id, { onDelete: 'cascade' }),
		userId: varchar('user_id', { length: 36 }).references(() => users.id, { onDelete: 'set null' }),
		body: varchar('body', { length: 2000 }).notNull(),
		createdAt: datetime('created_at').notNull()
	},
	(t) => [index('order_notes_order').on(t.orderId, t.id)]
);
