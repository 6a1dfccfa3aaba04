import { error } from '@sveltejs/kit';
import { readyByFor } from '$lib/queue/carving-queue';
import { standardMinutes } from '$lib/queue/layout-minutes';
import { queueOutlook } from '$lib/server/queue/carving-queue';
import { getPiece, largerRosettePieces } from '$lib/server/catalogue/catalogue';
import { addLine, cartCount, ensureCart } from '$lib/server/cart';
import { DomainError } from '$lib/server/errors/domain-error';
import { failFrom } from '$lib/server/errors/form-answer';
import { addLineSchema } from '$lib/cart/cart-schema';
import { hardnessWords, weightWords } from '$lib/catalogue/woods';
import type { Actions, PageServerLoad } from './$types';
import { firstError, formFail, parseForm } from '$lib/forms/parse-form';
import { drawPreview } from '$lib/pattern/personaliser-draw';
import { isRosetteStyle } from '$lib/pattern/styles';
import type { LargerPiece } from '$lib/pattern/ways-out';
import { config } from '$lib/server/config';
import { getShopInfo } from '$lib/server/settings/shop-settings';
import { photoUrl } from '$lib/catalogue/photos';
import { metaDescription } from '$lib/seo/describe';
import { jsonLdTag, productJsonLd } from '$lib/seo/product-ld';

/** The preview card (Open Graph) and the structured data for search engines. */
async function sharing(piece: NonNullable<Awaited<ReturnType<typeof getPiece>>>) {
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
	piece: NonNullable<Awaited<ReturnType<typeof getPiece>>>,
	chosen: { initials?: string; wood?: string; style?: string } = {},
	larger: LargerPiece[] = []
) {
	const wood = piece.woods.some((w) => w.slug === chosen.wood) ? chosen.wood : piece.woods[0]?.slug;
	const style = isRosetteStyle(chosen.style)
		? chosen.style
		: piece.pattern.split
			? 'split'
			: 'classic';
	return drawPreview({
		woods: piece.woods.map((w) => w.slug),
		larger,
		pattern: piece.pattern,
		widthMm: piece.widthMm,
		lengthMm: piece.lengthMm,
		thicknessMm: piece.thicknessMm,
		initials: chosen.initials ?? '',
		wood,
		style,
		idPrefix: 'pz'
	});
}

type Piece = NonNullable<Awaited<ReturnType<typeof getPiece>>>;
type Drawn = { standard: Record<string, number>; preview: ReturnType<typeof previewFor> };

/**
 * The page's rosettes (the first preview, close up and whole, and the standard layout in every
 * wood) depend on the piece alone, and getPiece hands out one object per catalogue version: they
 * are drawn once per version, not on every render (they were most of a render's time).
 */
const drawn = new WeakMap<Piece, Drawn>();
function drawnFor(piece: Piece): Drawn {
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

export const load: PageServerLoad = async ({ params }) => {
	const piece = await getPiece(params.slug);
	if (!piece) error(404, 'We do not have a piece at this address.');
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
};

export const actions: Actions = {
	/** Adds the piece, personalised or ready-made; the server checks and prices it again. */
	add: async ({ request, params, cookies, locals, url }) => {
		// A personalised line also needs initials, and the answer carries a preview.
		const parsed = await parseForm(request, addLineSchema, {
			input: (texts) => ({ ...texts, slug: params.slug })
		});
		const form = parsed.values;
		const personalised = form.mode === 'personalised';
		const values = {
			mode: personalised ? 'personalised' : 'ready',
			initials: form.initials ?? '',
			wood: form.wood ?? '',
			style: form.style ?? '',
			quantity: form.quantity ?? '1'
		};
		// Without JavaScript the page comes back drawn for what was typed, not the blank default,
		// with the ways out when the letters are too small.
		const redrawn = async () => {
			const piece = personalised ? await getPiece(params.slug) : null;
			if (!piece) return undefined;
			return previewFor(piece, values, await largerRosettePieces(piece.pattern.diameterMm));
		};
		const errors = parsed.ok ? {} : { ...parsed.errors };
		if (personalised && !values.initials.trim()) {
			errors.initials = ['Type one to three letters for the rosette.'];
		}
		if (!parsed.ok || Object.keys(errors).length) {
			const message = firstError(errors) ?? 'Check the form.';
			return formFail(400, message, { errors, values, preview: await redrawn() });
		}

		const input = { ...parsed.data, initials: personalised ? parsed.data.initials : undefined };
		try {
			const cartId = await ensureCart(cookies, locals.user?.id ?? null, url.protocol === 'https:');
			await addLine(cartId, input);
			return { added: true, count: await cartCount(cartId), values };
		} catch (err) {
			if (err instanceof DomainError) {
				const preview = err.fields?.initials ? await redrawn() : undefined;
				return failFrom(err, { values, preview });
			}
			throw err;
		}
	}
};
