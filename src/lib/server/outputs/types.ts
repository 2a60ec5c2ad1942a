/** One file made for one order: its name (unique within the order), type and bytes. */
export interface OutputFile {
	name: string;
	mime: string;
	bytes: Uint8Array;
}
