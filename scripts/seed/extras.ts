import { demoPhotos } from './photos';
import { demoReadyBy } from './ready-by';
import { demoBoothOrder } from './fairs';
import type { DemoExtra } from './types';

/**
 * Steps that run after the demo data is committed and need more than the database (photos
 * uploaded to the S3 stand-in, for instance). Add a step here; a failing step is reported and
 * does not undo the demo data.
 */
// The booth order joins the carving queue, so it comes before the queue dates the orders.
export const demoExtras: DemoExtra[] = [demoPhotos, demoBoothOrder, demoReadyBy];
