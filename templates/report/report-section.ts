/**
 * A part of the test report: an id and a renderer drawing from the cursor. The report is the
 * ordered list in report-sections.ts; adding a section is adding a file and one list entry.
 */
import type { DocumentSection } from '../pdf-kit/render-sections';
import type { ReportDocument } from './report-document';

export type ReportSection = DocumentSection<ReportDocument>;
