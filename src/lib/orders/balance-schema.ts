import { z } from 'zod';
import { balanceMethods } from './balance';

/** The owner records the rest of a deposit order as paid, and how. */
export const balanceSchema = z.object({
	method: z.enum(balanceMethods, { error: 'Say how the balance was paid.' })
});
