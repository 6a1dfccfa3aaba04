/** Plain names for the kinds of piece (singular and plural), shared by shop and workshop. */
export const KIND_NAMES: Record<string, { one: string; many: string }> = {
	bottle_holder: { one: 'Bottle holder', many: 'Bottle holders' },
	plate: { one: 'Plate', many: 'Plates' },
	box: { one: 'Box', many: 'Boxes' },
	ornament: { one: 'Ornament', many: 'Ornaments' },
	spoon: { one: 'Spoon', many: 'Spoons' },
	board: { one: 'Board', many: 'Boards' }
};

export const kindName = (kind: string, plural = false) =>
	KIND_NAMES[kind]?.[plural ? 'many' : 'one'] ?? kind;
