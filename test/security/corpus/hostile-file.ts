/**
 * The shape of one hostile upload in the corpus: the bytes and the name of the main part (and of
 * the SigMF samples), the multipart fields it is sent with, the test case kind that can take it,
 * and what a correct product does with it.
 */
export interface HostilePart {
  bytes: Buffer;
  /** The file name as a client sends it (may hold folders, control characters...). */
  name: string;
  contentType?: string;
}

export interface HostileFile {
  /** What is wrong with it, for test names and failure messages. */
  label: string;
  group: 'trace-csv' | 'sigmf' | 'wav' | 'raw-iq' | 'mislabelled' | 'file-name';
  file: HostilePart;
  data?: HostilePart;
  /** Multipart text fields (format, referenceDbm, sampleRateHz, ...). */
  fields: Record<string, string>;
  /** The test case kind whose evaluation reads this kind of file. */
  caseKind: 'emission-mask' | 'unwanted-sideband';
  /**
   * 'refuse': the product must refuse it (4xx, nothing stored; the CLI exits non-zero).
   * 'either': odd but readable (a BOM, CR line ends, a long name): refused or accepted, never a 5xx.
   */
  expect: 'refuse' | 'either';
  /**
   * For the command line, when it differs: it has no Content-Type, no upload fields and no
   * part names, so a file refused only for what those labels say is 'either' there.
   */
  cliExpect?: 'refuse' | 'either';
}
