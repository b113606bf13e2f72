/** A problem with an upload as a whole; `status` is the HTTP status to answer with. */
export class UploadError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
  ) {
    super(message);
    this.name = "UploadError";
  }
}
