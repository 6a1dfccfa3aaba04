import type { Edge } from './arrangement';
import type { Blank, Warning } from './blank';
import type { BorderInput, BorderLayout } from './borders';
import type { EffortModel } from './effort';
import type { Circle, Point } from './geometry';
import type { GlyphSource, Lettering, LetteringRules } from './lettering';

export type { Warning };

export type PatternInput = {
	diameterMm: number;
	count: number;
	/** Distance between neighbouring centres on the centre line; default the radius. */
	spacingMm?: number;
	/** Halve every chip along its axis (24 chips per rosette). */
	split?: boolean;
	initials?: string;
	/** Which rosette carries the initials (0-based); default the middle one. */
	initialsOn?: number;
	woodSlug?: string;
	widthMm: number;
	lengthMm: number;
	thicknessMm?: number;
	curvedTop?: boolean;
	/** Plain wood kept round the pattern; default 5 mm. */
	marginMm?: number;
	/** Distance of the first centre from the top end; default: the row centred on the length. */
	firstCentreMm?: number;
	/** A border band on the long edge; left out when absent. */
	border?: Partial<BorderInput> | null;
	lettering?: Partial<LetteringRules>;
	effort?: Partial<EffortModel>;
};

export type PatternOptions = {
	/** Outlines for the initials; without one the SVG sets them as text and no letter outlines are measured. */
	font?: GlyphSource | null;
	/** Prefix for SVG ids, so several drawings can share a page. */
	idPrefix?: string;
	/** Blank paper round the drawing in the SVG, mm; default 4. */
	padMm?: number;
	/** Show only the rosettes, `closeUpMm` of wood round them (a close-up of the carving). */
	closeUpMm?: number;
	/** Leave out the SVG string (the PDF and the API's light callers do not need it). */
	svg?: boolean;
};

export type ChipKind =
	'petal' | 'between' | 'half-petal' | 'half-between' | 'part' | 'triangle' | 'letter';

export type Chip = { kind: ChipKind; areaMm2: number; cutLengthMm: number };

export type DrawnChip = Chip & { edges: Edge[]; centroid: Point };

/** Everything needed to draw the layout, in mm (SVG orientation: y down). */
export type Drawing = {
	widthMm: number;
	heightMm: number;
	blank: Blank & { outline: string };
	centreLineX: number;
	chips: DrawnChip[];
	/** Every drawn line of the rosettes once, as SVG path data. */
	lines: string;
	lettering: Lettering | null;
	border: (BorderLayout & { x: number; y: number }) | null;
};

export type PatternResult = {
	compassRadiusMm: number;
	rosettes: Circle[];
	chips: Chip[];
	/** Chips of the rosettes and the border; letters are counted apart. */
	chipCount: number;
	letterCount: number;
	cutLengthMm: number;
	estimateMinutes: number;
	warnings: Warning[];
	steps: string[];
	svg: string;
	drawing: Drawing;
};
