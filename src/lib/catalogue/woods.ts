/**
 * Woods carvers use, with their published properties.
 * Specific gravity G and side (Janka) hardness at 12 % moisture content: USDA Forest Products
 * Laboratory, Wood Handbook (FPL-GTR-190, 2010, Table 5-3a; FPL-GTR-282, 2021, Table 5-3b).
 * Density at 12 % MC: ρ = 1000 · G · (1 + 0.12) kg/m³, the handbook's relation between specific
 * gravity and density at a given moisture content.
 */
export type WoodFacts = {
	slug: string;
	name: string;
	botanicalName: string;
	specificGravity: number;
	sideHardnessLbf: number;
	sideHardnessN: number;
	toneLight: string;
	toneDark: string;
	character: string;
	caution?: string;
};

export const MOISTURE_CONTENT = 0.12;

/** Density in kg/m³ at 12 % MC from specific gravity (Wood Handbook relation). */
export function densityAt12(specificGravity: number): number {
	return Math.round(1000 * specificGravity * (1 + MOISTURE_CONTENT));
}

export const WOODS: WoodFacts[] = [
	{
		slug: 'basswood',
		name: 'Basswood',
		botanicalName: 'Tilia americana',
		specificGravity: 0.37,
		sideHardnessLbf: 410,
		sideHardnessN: 1800,
		toneLight: '#f1e4c8',
		toneDark: '#c9ae82',
		character: 'Pale cream, soft and even: the carver’s favourite, crisp chips and clean initials.'
	},
	{
		slug: 'butternut',
		name: 'Butternut',
		botanicalName: 'Juglans cinerea',
		specificGravity: 0.38,
		sideHardnessLbf: 490,
		sideHardnessN: 2200,
		toneLight: '#e2c79c',
		toneDark: '#a9814f',
		character: 'Light tan with a soft figure; carves almost as easily as basswood.',
		caution: 'A walnut relative: its dust can irritate skin and airways.'
	},
	{
		slug: 'cherry',
		name: 'Black cherry',
		botanicalName: 'Prunus serotina',
		specificGravity: 0.5,
		sideHardnessLbf: 950,
		sideHardnessN: 4200,
		toneLight: '#dba57e',
		toneDark: '#9a5a37',
		character: 'Warm pinkish brown that deepens with light; moderately hard, fine grain.'
	},
	{
		slug: 'walnut',
		name: 'Black walnut',
		botanicalName: 'Juglans nigra',
		specificGravity: 0.55,
		sideHardnessLbf: 1010,
		sideHardnessN: 4500,
		toneLight: '#a37a57',
		toneDark: '#5b3c26',
		character: 'Rich chocolate brown; hard, so the cuts take longer and show strongly.',
		caution: 'Walnut dust is a known skin and airway sensitiser.'
	},
	{
		slug: 'maple',
		name: 'Sugar maple',
		botanicalName: 'Acer saccharum',
		specificGravity: 0.63,
		sideHardnessLbf: 1450,
		sideHardnessN: 6400,
		toneLight: '#f3e6cf',
		toneDark: '#cdb38c',
		character: 'Creamy white and very hard: a crisp, pale piece that is slow to carve.'
	}
];

export function woodBySlug(slug: string): WoodFacts | undefined {
	return WOODS.find((w) => w.slug === slug);
}

/** Plain words for hardness, for buyers. */
export function hardnessWords(sideHardnessN: number): string {
	if (sideHardnessN < 2500) return 'soft';
	if (sideHardnessN < 5000) return 'medium-hard';
	return 'hard';
}

/** Plain words for weight, for buyers. */
export function weightWords(densityKgM3: number): string {
	if (densityKgM3 < 450) return 'light';
	if (densityKgM3 < 620) return 'medium weight';
	return 'heavy';
}
