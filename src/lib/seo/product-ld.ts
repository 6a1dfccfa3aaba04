/**
 * A piece as schema.org structured data (JSON-LD), for search engines: a `Product` with one
 * `Offer` carrying the price (the "from" price, in the currency's major units as schema.org
 * asks), the ISO 4217 currency and the availability. Built on the server only: the vocabulary's
 * addresses are names, never fetched, and stay out of the browser bundle.
 * Vocabulary: https://schema.org/Product, https://schema.org/Offer,
 * https://schema.org/ItemAvailability.
 */
import { minorDigits } from '$lib/locale/money';

export type ProductFacts = {
	slug: string;
	title: string;
	summary: string;
	currency: string;
	fromMinor: number;
	personalisable: boolean;
	/** Finished pieces on the workshop shelf, over all woods. */
	inStock: number;
	/** Absolute addresses of the piece's photos, lead photo first. */
	images: string[];
	/** The piece page's absolute address. */
	url: string;
	/** The shop's name, as the brand and seller. */
	shop: string;
};

/** Made to order when personalised, else in stock or out of stock by the shelf count. */
export function availabilityOf(f: Pick<ProductFacts, 'personalisable' | 'inStock'>) {
	if (f.personalisable) return 'https://schema.org/MadeToOrder';
	return f.inStock > 0 ? 'https://schema.org/InStock' : 'https://schema.org/OutOfStock';
}

/** Minor units as schema.org's `price`: a plain decimal with a full stop, no sign or grouping. */
export function ldPrice(minor: number, currency: string): string {
	const d = minorDigits(currency);
	return d === 0 ? String(minor) : (minor / 10 ** d).toFixed(d);
}

export function productJsonLd(f: ProductFacts) {
	return {
		'@context': 'https://schema.org',
		'@type': 'Product',
		name: f.title,
		description: f.summary,
		sku: f.slug,
		url: f.url,
		...(f.images.length ? { image: f.images } : {}),
		brand: { '@type': 'Brand', name: f.shop },
		offers: {
			'@type': 'Offer',
			url: f.url,
			price: ldPrice(f.fromMinor, f.currency),
			priceCurrency: f.currency,
			availability: availabilityOf(f),
			itemCondition: 'https://schema.org/NewCondition',
			seller: { '@type': 'Organization', name: f.shop }
		}
	};
}

/**
 * JSON for inside a `<script>` element: `<` is written as `\u003c`, so a title holding
 * `</script>` cannot end the element early (the JSON means the same to any parser).
 */
export function scriptJson(value: unknown): string {
	return JSON.stringify(value)
		.replace(/</g, '\\u003c')
		.replace(/\u2028/g, '\\u2028')
		.replace(/\u2029/g, '\\u2029');
}

/** The data block for a page's head: not run as a script (its type is not JavaScript). */
export function jsonLdTag(value: unknown): string {
	return `<script type="application/ld+json">${scriptJson(value)}</script>`;
}
