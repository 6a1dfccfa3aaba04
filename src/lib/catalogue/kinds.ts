/**
 * The kinds of piece, defined once: the database enum (db/schema.ts), the zod schemas of the
 * piece form and the shop filter, and the words shown to people all come from here.
 */
export const pieceKinds = ['bottle_holder', 'plate', 'box', 'ornament', 'spoon', 'board'] as const;
export type PieceKind = (typeof pieceKinds)[number];

/** Plain names for the kinds of piece (singular and plural), shared by shop and workshop. */
export const KIND_NAMES: Record<PieceKind, { one: string; many: string }> = {
	bottle_holder: { one: 'Bottle holder', many: 'Bottle holders' },
	plate: { one: 'Plate', many: 'Plates' },
	box: { one: 'Box', many: 'Boxes' },
	ornament: { one: 'Ornament', many: 'Ornaments' },
	spoon: { one: 'Spoon', many: 'Spoons' },
	board: { one: 'Board', many: 'Boards' }
};

export const kindName = (kind: string, plural = false) =>
	KIND_NAMES[kind as PieceKind]?.[plural ? 'many' : 'one'] ?? kind;
