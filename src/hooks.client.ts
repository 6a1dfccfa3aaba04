import { z } from 'zod';

// zod probes for `Function('')` to compile fast validators; under our Content-Security-Policy
// (no 'unsafe-eval') that probe is a reported violation. The planner and the personaliser
// validate small forms, so the interpreted path is plenty.
z.config({ jitless: true });
