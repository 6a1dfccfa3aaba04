/** A sale in the booth's list to check (this phone's and the server's), voidable with a reason. */
export type DaySale = {
	id: string;
	at: string;
	summary: string;
	totalMinor: number | null;
	voided: boolean;
	late?: boolean;
	waiting: boolean;
};
