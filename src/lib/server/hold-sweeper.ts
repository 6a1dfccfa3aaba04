// Kept for the server hook's import; the sweeper lives with the other holds.
export { startHoldSweeper } from './orders/holds';
