/**
 * The rosette styles a buyer can choose. Plain constants, apart from the schemas that check a
 * choice, so the browser's personaliser can list them without the validation library.
 */
export const ROSETTE_STYLES = {
	classic: { split: false, label: 'Classic', hint: 'Six petals, twelve chips a rosette' },
	split: {
		split: true,
		label: 'Split petals',
		hint: 'Every chip halved: twenty-four smaller chips'
	}
} as const;
export type RosetteStyle = keyof typeof ROSETTE_STYLES;
