/**
 * The rosette layout engine: one call from inputs to geometry, counts, estimate, steps and SVG.
 * Pure and synchronous; the same code runs for the live preview and the server's PDF.
 */
import { woodBySlug, WOODS } from '../catalogue/woods';
import { type CurveSpec, type Face, type SegSpec, buildArrangement } from './arrangement';
import { axisOf } from './split';
import { blankOutline, fitWarnings, placeRosettes, type Blank } from './blank';
import {
	BORDER_DEFAULTS,
	layoutBorder,
	triangleArea,
	trianglePerimeter,
	type BorderInput
} from './borders';
import { clipOutsideDisc } from './clip';
import { EFFORT_DEFAULTS, estimateMinutes } from './effort';
import { LETTERING_DEFAULTS, setInitials } from './lettering';
import { letterLimits } from './cuttable';
import { chipKindAt, rosetteAt, rosetteCurves, type RosetteGeometry } from './rosette';
import { edgesPath } from './paths';
import { layoutSteps } from './steps';
import { renderSvg } from './svg';
import type { ChipKind, DrawnChip, PatternInput, PatternOptions, PatternResult } from './types';

export type * from './types';
export type { GlyphSource } from './lettering';

/** Gap between the face drawing and the edge strip, mm. */
const STRIP_GAP = 12;

export function computePattern(input: PatternInput, options: PatternOptions = {}): PatternResult {
	const r = input.diameterMm / 2;
	const spacing = input.spacingMm ?? r;
	const split = !!input.split;
	const wood = woodBySlug(input.woodSlug ?? '') ?? WOODS[0];
	const blank: Blank = {
		widthMm: input.widthMm,
		lengthMm: input.lengthMm,
		thicknessMm: input.thicknessMm,
		curvedTop: !!input.curvedTop,
		marginMm: input.marginMm ?? 5
	};
	const circles = placeRosettes(blank, r, input.count, spacing, input.firstCentreMm);
	const rosettes = circles.map((c) => rosetteAt(c.x, c.y, c.r));

	const initials = (input.initials ?? '').trim();
	// The wood sets the smallest letters that carve cleanly (cuttable.ts); a layout may override.
	const { minCapHeightMm, minStrokeMm } = letterLimits(wood.slug);
	const rules = { ...LETTERING_DEFAULTS, minCapHeightMm, minStrokeMm, ...input.lettering };
	const initialsOn = Math.min(
		Math.max(0, input.initialsOn ?? Math.floor((input.count - 1) / 2)),
		input.count - 1
	);
	const lettering = initials
		? setInitials(initials, circles[initialsOn], options.font, rules)
		: null;

	let curves: CurveSpec[] = rosettes.flatMap((g, i) => rosetteCurves(g, i));
	if (lettering) {
		curves = clipOutsideDisc(curves, lettering.medallion);
		curves.push({
			kind: 'arc',
			c: lettering.medallion,
			from: 0,
			to: 2 * Math.PI,
			tag: 'medallion'
		});
	}
	let arrangement = buildArrangement(curves);
	if (split) {
		// Second pass: each whole chip's own axis added to the drawing (see split.ts).
		const home = lettering ? rosettes[initialsOn] : null;
		const axes = arrangement.faces
			.filter((f) => !(f.tags.size === 1 && f.tags.has('medallion')))
			.map((f) => axisOf(f, lettering?.medallion ?? null, home))
			.filter((a): a is SegSpec => a !== null);
		arrangement = buildArrangement([...curves, ...axes]);
	}

	const chips: DrawnChip[] = [];
	for (const face of arrangement.faces) {
		if (face.tags.size === 1 && face.tags.has('medallion')) continue; // the plain medallion
		chips.push({
			kind: classify(face, rosettes, split, lettering ? initialsOn : -1),
			areaMm2: face.area,
			cutLengthMm: face.perimeter,
			edges: face.edges,
			centroid: face.centroid
		});
	}

	let border: PatternResult['drawing']['border'] = null;
	if (input.border) {
		const edgeMm = input.border.edgeMm ?? input.thicknessMm ?? 20;
		const b: BorderInput = { ...BORDER_DEFAULTS, ...input.border, edgeMm };
		border = { ...layoutBorder(b, blank.lengthMm), x: blank.widthMm + STRIP_GAP, y: 0 };
		for (const t of border.triangles) {
			const pts = t.map((p) => ({ x: border!.x + p.y, y: border!.y + p.x }));
			chips.push({
				kind: 'triangle',
				areaMm2: triangleArea(t),
				cutLengthMm: trianglePerimeter(t),
				edges: [],
				centroid: pts[0]
			});
		}
	}

	const letterChips = (lettering?.letters ?? []).map((l) => ({
		kind: 'letter' as const,
		areaMm2: l.areaMm2,
		cutLengthMm: l.outlineMm
	}));
	const counted = chips.map(({ kind, areaMm2, cutLengthMm }) => ({ kind, areaMm2, cutLengthMm }));
	const allChips = [...counted, ...letterChips];
	const effort = { ...EFFORT_DEFAULTS, ...input.effort };
	const letterCount = initials.length;
	const minutes = estimateMinutes(counted, letterCount, wood.sideHardnessN, effort);
	const warnings = [
		...fitWarnings(blank, circles),
		...(lettering?.warnings ?? []),
		...(border?.warnings ?? [])
	];
	const drawing: PatternResult['drawing'] = {
		widthMm: border ? border.x + border.edgeMm : blank.widthMm,
		heightMm: blank.lengthMm,
		blank: { ...blank, outline: blankOutline(blank) },
		centreLineX: blank.widthMm / 2,
		chips,
		lines: edgesPath(arrangement.edges),
		lettering,
		border
	};
	const result: PatternResult = {
		compassRadiusMm: r,
		rosettes: circles,
		chips: allChips,
		chipCount: counted.length,
		letterCount,
		cutLengthMm: allChips.reduce((s, c) => s + c.cutLengthMm, 0),
		estimateMinutes: minutes,
		warnings,
		steps: [],
		svg: '',
		drawing
	};
	result.steps = layoutSteps(input, result, wood.name);
	if (options.svg !== false) {
		const view = options.closeUpMm !== undefined ? closeUp(circles, options.closeUpMm) : undefined;
		result.svg = renderSvg(drawing, wood, options.idPrefix ?? 'rz', options.padMm ?? 4, view);
	}
	return result;
}

/** The box round all the rosettes, `around` mm wider on every side. */
function closeUp(circles: { x: number; y: number; r: number }[], around: number) {
	const x0 = Math.min(...circles.map((c) => c.x - c.r)) - around;
	const x1 = Math.max(...circles.map((c) => c.x + c.r)) + around;
	const y0 = Math.min(...circles.map((c) => c.y - c.r)) - around;
	const y1 = Math.max(...circles.map((c) => c.y + c.r)) + around;
	return { x: x0, y: y0, w: x1 - x0, h: y1 - y0 };
}

/**
 * A chip's kind from its shape: two arcs make a lens (petal); three arcs the curved triangle
 * between petals; with a ruled axis, the halves of those. Chips the medallion cuts take the kind
 * of the place they sit in that rosette. Anything else (where rosettes at an odd spacing cut
 * each other's chips) is a 'part'.
 */
function classify(
	face: Face,
	rosettes: RosetteGeometry[],
	split: boolean,
	medallionOn: number
): ChipKind {
	const arcs = face.sideKinds.filter((k) => k === 'arc').length;
	const lines = face.sideKinds.length - arcs;
	if (face.tags.has('medallion') && medallionOn >= 0) {
		const k = chipKindAt(rosettes[medallionOn], face.centroid);
		if (k) return split && lines > 0 ? `half-${k}` : k;
	}
	if (lines === 0 && arcs === 2) return 'petal';
	if (lines === 0 && arcs === 3) return 'between';
	if (lines === 1 && arcs === 1) return 'half-petal';
	if (lines === 1 && arcs === 2) return 'half-between';
	return 'part';
}
