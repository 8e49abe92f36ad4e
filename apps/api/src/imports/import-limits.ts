import { importMaxFileBytes, importMaxRows } from '@millrace/contracts';

/**
 * Limits of one import, in one place. The file size bounds the upload (multer stops reading at
 * the limit); the row and column counts are checked by a counting pass that keeps no rows, before
 * the file is read in full, so a huge file never fills the memory.
 */
export const importLimits = {
  maxFileBytes: importMaxFileBytes,
  maxRows: importMaxRows,
  /** columns of the header row */
  maxColumns: 200,
  /** a workbook's rows over all its sheets (every sheet is loaded when an XLSX file is opened) */
  maxWorkbookRows: 3 * importMaxRows,
  /** longest file name kept in the history */
  maxFileNameLength: 200,
  /** rows searched for the header row when none is given */
  headerSearchRows: 30,
} as const;

export const maxFileMegabytes = importMaxFileBytes / 1024 / 1024;
