import { browser } from '$app/environment';
import { z } from 'zod';

// zod probes for `Function('')` to compile fast validators; under our Content-Security-Policy
// (no 'unsafe-eval') that probe is a reported violation. Only the pages that validate in the
// browser (the planner, the orders table) import this, so other pages ship no zod at all.
if (browser) z.config({ jitless: true });
