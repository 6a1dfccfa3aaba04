/**
 * Parses Stripe-style form bodies and query strings: `a[b][0][c]=1` and `expand[]=x` become nested
 * objects and arrays, as the SDK's encoder writes them.
 */
export type FormValue = string | FormValue[] | { [key: string]: FormValue };
export type Form = { [key: string]: FormValue };

function pathOf(key: string): string[] {
	const first = key.indexOf('[');
	if (first < 0) return [key];
	const parts = [key.slice(0, first)];
	for (const m of key.slice(first).matchAll(/\[([^\]]*)\]/g)) parts.push(m[1]);
	return parts;
}

/** Objects whose keys are exactly 0..n-1 turn into arrays, recursively. */
function arraysFrom(value: FormValue): FormValue {
	if (typeof value === 'string' || Array.isArray(value)) return value;
	const keys = Object.keys(value);
	const out: Record<string, FormValue> = {};
	for (const k of keys) out[k] = arraysFrom(value[k]);
	const isList =
		keys.length > 0 &&
		keys.every((k) => /^\d+$/.test(k)) &&
		keys
			.map(Number)
			.sort((a, b) => a - b)
			.every((n, i) => n === i);
	if (!isList) return out;
	return keys
		.map(Number)
		.sort((a, b) => a - b)
		.map((i) => out[String(i)]);
}

/**
 * Keys that would reach an object's prototype instead of a property of its own. A body such as
 * `__proto__[x]=y` must not set `Object.prototype.x` in the stand-in's process.
 */
const UNSAFE_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

export function parseForm(text: string): Form {
	const root: Record<string, FormValue> = {};
	for (const [rawKey, value] of new URLSearchParams(text)) {
		const path = pathOf(rawKey);
		if (path.some((seg) => UNSAFE_KEYS.has(seg))) continue;
		let node: Record<string, FormValue> = root;
		for (let i = 0; i < path.length; i++) {
			let seg = path[i];
			const last = i === path.length - 1;
			// `key[]` appends: number it after what is already there.
			if (seg === '') seg = String(Object.keys(node).length);
			if (last) {
				node[seg] = value;
			} else {
				const next = node[seg];
				if (typeof next !== 'object' || next === null || Array.isArray(next)) node[seg] = {};
				node = node[seg] as Record<string, FormValue>;
			}
		}
	}
	return arraysFrom(root) as Form;
}
