import { invalid, missing } from './errors';
import type { Form, FormValue } from './form';
import type { Metadata } from './state';

/** Readers for form parameters that fail the way Stripe's API does (400 with the param named). */
export function str(v: FormValue | undefined, param: string, required: true): string;
export function str(v: FormValue | undefined, param: string, required?: false): string | undefined;
export function str(v: FormValue | undefined, param: string, required = false) {
	if (v === undefined || v === '') {
		if (required) throw missing(param);
		return undefined;
	}
	if (typeof v !== 'string')
		throw invalid(param, `Invalid string: ${param} must be a string.`, 'parameter_invalid_string');
	return v;
}

export function int(v: FormValue | undefined, param: string, required: true): number;
export function int(v: FormValue | undefined, param: string, required?: false): number | undefined;
export function int(v: FormValue | undefined, param: string, required = false) {
	const s = str(v, param, required as false);
	if (s === undefined) return undefined;
	if (!/^-?\d+$/.test(s) || !Number.isSafeInteger(Number(s)))
		throw invalid(param, `Invalid integer: ${s}`, 'parameter_invalid_integer');
	return Number(s);
}

export function obj(v: FormValue | undefined, param: string): Form | undefined {
	if (v === undefined || v === '') return undefined;
	if (typeof v !== 'object' || Array.isArray(v))
		throw invalid(param, `Invalid object: ${param} must be a hash.`);
	return v;
}

export function list(v: FormValue | undefined, param: string): FormValue[] | undefined {
	if (v === undefined || v === '') return undefined;
	if (!Array.isArray(v))
		throw invalid(param, `Invalid array: ${param} must be an array.`, 'parameter_invalid_array');
	return v;
}

/** Stripe's metadata limits: 50 keys, key ≤ 40 characters, value ≤ 500 characters. */
export function metadata(v: FormValue | undefined, param: string): Metadata {
	const m = obj(v, param) ?? {};
	const out: Metadata = {};
	const keys = Object.keys(m);
	if (keys.length > 50) throw invalid(param, 'Metadata can have at most 50 keys.');
	for (const k of keys) {
		const value = m[k];
		if (typeof value !== 'string')
			throw invalid(`${param}[${k}]`, 'Metadata values must be strings.');
		if (k.length > 40)
			throw invalid(`${param}[${k}]`, 'Metadata keys can be at most 40 characters long.');
		if (value.length > 500)
			throw invalid(`${param}[${k}]`, 'Metadata values can be at most 500 characters long.');
		if (value !== '') out[k] = value;
	}
	return out;
}

/** Rejects parameters the stand-in does not know, like the real API does. */
export function onlyKnown(form: Form, known: string[]) {
	for (const k of Object.keys(form)) {
		if (!known.includes(k))
			throw invalid(k, `Received unknown parameter: ${k}`, 'parameter_unknown');
	}
}

const currencies = new Set(Intl.supportedValuesOf('currency').map((c) => c.toLowerCase()));

export function currency(v: FormValue | undefined, param: string) {
	const c = str(v, param, true).toLowerCase();
	if (!currencies.has(c)) throw invalid(param, `Invalid currency: ${c}.`);
	return c;
}

export function url(v: FormValue | undefined, param: string, required: boolean) {
	const s = required ? str(v, param, true) : str(v, param);
	if (s === undefined) return null;
	try {
		const u = new URL(s.replace('{CHECKOUT_SESSION_ID}', 'x'));
		if (u.protocol !== 'http:' && u.protocol !== 'https:') throw new Error();
	} catch {
		throw invalid(param, 'Not a valid URL', 'url_invalid');
	}
	return s;
}
