/** A part of the receipt: an id and a renderer (see receipt-sections.ts for the list). */
import type { DocumentSection } from '../pdf-kit/render-sections';
import type { ReceiptDocument } from './receipt-document';

export type ReceiptSection = DocumentSection<ReceiptDocument>;
