import { PDFArray, PDFDocument, PDFRawStream, PDFRef, decodePDFRawStream } from 'pdf-lib';

/** A page's content streams, decoded, as text: the drawing operators to read numbers from. */
export function pageContent(doc: PDFDocument, index: number): string {
	const contents = doc.getPage(index).node.Contents();
	const refs = contents instanceof PDFArray ? contents.asArray() : [contents];
	return refs
		.map((r) => {
			const s = r instanceof PDFRef ? doc.context.lookup(r) : r;
			return s instanceof PDFRawStream
				? new TextDecoder('latin1').decode(decodePDFRawStream(s).decode())
				: '';
		})
		.join('\n');
}
