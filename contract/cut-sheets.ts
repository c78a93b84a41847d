/** Luminaire types' cut sheets as the service answers them and the web app reads them. */

/** The largest cut sheet taken: 20 MB. */
export const cutSheetMaxBytes = 20 * 1024 * 1024;

/** The longest file name kept for a cut sheet; a longer one is shortened, its `.pdf` kept. */
export const cutSheetNameMaxLength = 200;

/** One cut sheet on file, in `GET /api/projects/:id/cut-sheets` and the answer to an upload. */
export interface CutSheet {
  luminaireTypeId: string;
  fileName: string;
  /** In bytes. */
  size: number;
  sha256: string;
  uploadedAt: string;
  /** Null when the person's account no longer exists. */
  uploadedBy: string | null;
  /** Where the file is downloaded. */
  url: string;
}
