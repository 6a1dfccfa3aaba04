/** The app's settings: one source with the scripts and the stand-ins (see config/settings.ts). */
export { config } from '../../../config/settings';
