/**
 * What the shop's piece page shows: the piece, its sharing card and structured data, the
 * personaliser's first picture and the carving queue's date. The route only asks for it.
 */
import { readyByFor } from '$lib/queue/carving-queue';
import { standardMinutes } from '$lib/queue/layout-minutes';
import { queueOutlook } from '$lib/server/queue/carving-queue';
import { getPiece, largerRosettePieces, type PieceDetail } from '$lib/server/catalogue/catalogue';
import { hardnessWords, weightWords } from '$lib/catalogue/woods';
import { photoUrl } from '$lib/catalogue/photos';
import { drawPreview } from '$lib/pattern/personaliser-draw';
import { startingStyle } from '$lib/pattern/styles';
import type { LargerPiece } from '$lib/pattern/ways-out';
import { config } from '$lib/server/config';
import { getShopInfo } from '$lib/server/settings/shop-settings';
import { metaDescription } from '$lib/seo/describe';
import { jsonLdTag, productJsonLd } from '$lib/seo/product-ld';

/** The preview card (Open Graph) and the structured data for search engines. */
async function sharing(piece: PieceDetail) {
	const shop = await getShopInfo();
	const url = `${config.origin}/shop/${piece.slug}`;
	// JPEG, since not every preview-card reader takes WebP.
	const images = piece.photos.map((p) => `${config.origin}${photoUrl(p.storageKey, 1600, 'jpg')}`);
	const lead = piece.photos[0];
	return {
		description: metaDescription(piece.summary || piece.description || piece.title),
		url,
		siteName: shop.name,
		image: lead
			? {
					url: images[0],
					alt: lead.alt,
					width: Math.min(1600, lead.width),
					height: Math.round((lead.height * Math.min(1600, lead.width)) / lead.width)
				}
			: null,
		jsonLdTag: jsonLdTag(
			productJsonLd({
				slug: piece.slug,
				title: piece.title,
				summary: piece.summary || piece.title,
				currency: piece.currency,
				fromMinor: piece.fromMinor,
				personalisable: piece.personalisable,
				inStock: piece.woods.reduce((n, w) => n + w.inStock, 0),
				images,
				url,
				shop: shop.name
			})
		)
	};
}

/** The personaliser's first picture, for the props the page gives it (its id prefix is "pz"). */
function previewFor(
	piece: PieceDetail,
	chosen: { initials?: string; wood?: string; style?: string } = {},
	larger: LargerPiece[] = []
) {
	const wood = piece.woods.some((w) => w.slug === chosen.wood) ? chosen.wood : piece.woods[0]?.slug;
	return drawPreview({
		woods: piece.woods.map((w) => w.slug),
		larger,
		pattern: piece.pattern,
		widthMm: piece.widthMm,
		lengthMm: piece.lengthMm,
		thicknessMm: piece.thicknessMm,
		initials: chosen.initials ?? '',
		wood,
		style: startingStyle(piece.pattern, chosen.style),
		idPrefix: 'pz'
	});
}

type Drawn = { standard: Record<string, number>; preview: ReturnType<typeof previewFor> };

/**
 * The page's rosettes (the first preview, close up and whole, and the standard layout in every
 * wood) depend on the piece alone, and getPiece hands out one object per catalogue version: they
 * are drawn once per version, not on every render (they were most of a render's time).
 */
const drawn = new WeakMap<PieceDetail, Drawn>();
function drawnFor(piece: PieceDetail): Drawn {
	let d = drawn.get(piece);
	if (!d) {
		// The standard layout's minutes per wood are worked out here, so the page's script needs no
		// pattern engine until the buyer starts typing (the engine then loads on its own).
		const standard = Object.fromEntries(
			piece.personalisable
				? piece.woods.map((w) => [w.slug, standardMinutes(piece.pattern, piece, w.slug)])
				: []
		) as Record<string, number>;
		drawn.set(piece, (d = { standard, preview: previewFor(piece) }));
	}
	return d;
}

/** Everything the piece page shows, or null when there is no piece at this address. */
export async function piecePage(slug: string) {
	const piece = await getPiece(slug);
	if (!piece) return null;
	const { standard, preview } = drawnFor(piece);
	const queue = { ...(await queueOutlook()), standardMinutes: standard };
	const firstWood = piece.woods[0]?.slug;
	// The date shown before the buyer types anything: the standard layout joining the queue now.
	const queueReadyBy =
		piece.personalisable && firstWood
			? readyByFor(
					queue.minutesAhead,
					standard[firstWood],
					queue.schedule,
					queue.today,
					queue.extraDaysOff
				)
			: null;
	return {
		sharing: await sharing(piece),
		preview,
		// Where a buyer whose initials are too small here can go: chosen here, checked in the page.
		larger: piece.personalisable ? await largerRosettePieces(piece.pattern.diameterMm) : [],
		queue,
		queueReadyBy,
		piece: {
			...piece,
			woods: piece.woods.map((w) => ({
				slug: w.slug,
				name: w.name,
				toneLight: w.toneLight,
				toneDark: w.toneDark,
				priceAddOnMinor: w.priceAddOnMinor,
				inStock: w.inStock,
				hardness: hardnessWords(w.sideHardnessN),
				weight: weightWords(w.densityKgM3),
				densityKgM3: w.densityKgM3,
				character: w.character,
				caution: w.caution ?? undefined
			}))
		}
	};
}

/**
 * The personaliser's picture redrawn for what a buyer posted, with the ways out when the letters
 * are too small: without JavaScript the page comes back drawn for what was typed, not the blank
 * default. Undefined for a ready-made line or a piece that is gone.
 */
export async function redrawnPreview(
	slug: string,
	chosen: { mode: string; initials?: string; wood?: string; style?: string }
) {
	const piece = chosen.mode === 'personalised' ? await getPiece(slug) : null;
	if (!piece) return undefined;
	return previewFor(piece, chosen, await largerRosettePieces(piece.pattern.diameterMm));
}
