// A refused upload. The code lets callers map the refusal (to a 400/422 or a form message)
// without parsing text; the message is written to be shown to the person uploading.

export type ImageRejectedCode =
  | "not_an_image"
  | "unsupported_format"
  | "too_large"
  | "too_many_pixels"
  | "corrupt";

export class ImageRejectedError extends Error {
  readonly code: ImageRejectedCode;

  constructor(code: ImageRejectedCode, message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = "ImageRejectedError";
    this.code = code;
  }
}

export function isImageRejectedError(err: unknown): err is ImageRejectedError {
  return err instanceof ImageRejectedError;
}
