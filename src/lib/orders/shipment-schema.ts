import { z } from 'zod';

// C0 and C1 control characters (and DEL): never part of a carrier's name or a tracking number.
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const CONTROL = /[\u0000-\u001f\u007f-\u009f]/;

/** What the workshop types when a parcel goes: who carries it and its tracking number. */
export const shipmentSchema = z.object({
	carrier: z
		.string({ error: 'Say which carrier has the parcel.' })
		.refine((s) => !CONTROL.test(s), 'The carrier name has a control character in it.')
		.transform((s) => s.trim())
		.pipe(
			z
				.string()
				.min(2, 'Say which carrier has the parcel.')
				.max(60, 'Keep the carrier name under 60 characters.')
		),
	trackingNumber: z
		.string({ error: 'Type the tracking number from the label.' })
		.refine(
			(s) => !CONTROL.test(s),
			'The tracking number has a control character in it (a pasted tab or line break?). Type it again.'
		)
		.transform((s) => s.replace(/[\s-]/g, '').toUpperCase())
		.pipe(
			z
				.string()
				.min(6, 'A tracking number has at least 6 letters or digits.')
				.max(40, 'A tracking number has at most 40 letters or digits.')
				.regex(/^[A-Z0-9]+$/, 'A tracking number is letters and digits only.')
		)
});
export type ShipmentInput = z.infer<typeof shipmentSchema>;
