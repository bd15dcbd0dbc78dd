// Reads an Upload API request body the ways Cloudinary clients send it: multipart/form-data
// (the Node SDK always, browsers with FormData) or urlencoded. The `file` parameter is
// either a file part or a string, usually a data: URI (the Node SDK sends data URIs as a
// plain field). Bodies are capped while streaming so an oversize upload is never buffered.

import type { IncomingMessage } from "node:http";
import busboy from "busboy";

export interface UploadFile {
  data: Buffer;
  /** Name the client gave the part; "file" when the upload was a data: URI. */
  filename: string;
}

export interface UploadForm {
  fields: Record<string, string>;
  file?: UploadFile;
}

// Always answered as 400: the Node SDK treats any status outside 200/400/401/404/420/429/500
// as an unexpected failure and drops the message.
export class FormError extends Error {
  readonly status = 400;
  constructor(message: string) {
    super(message);
    this.name = "FormError";
  }
}

export interface ReadFormOptions {
  maxFileBytes: number;
  tooLargeMessage: string;
}

const MAX_FIELDS = 100;
const MAX_PLAIN_FIELD_BYTES = 64 * 1024;

// Base64 grows data by 4/3; allow for the "data:image/jpeg;base64," prefix.
function maxDataUriChars(maxFileBytes: number): number {
  return Math.ceil(maxFileBytes / 3) * 4 + 256;
}

export async function readUploadForm(req: IncomingMessage, opts: ReadFormOptions): Promise<UploadForm> {
  const type = (req.headers["content-type"] ?? "").toLowerCase();
  const raw = type.startsWith("multipart/form-data")
    ? await readMultipart(req, opts)
    : type.startsWith("application/x-www-form-urlencoded")
      ? await readUrlencoded(req, opts)
      : null;
  if (!raw) {
    req.resume();
    throw new FormError("Unsupported Content-Type; send multipart/form-data or application/x-www-form-urlencoded");
  }

  const { fields } = raw;
  let file = raw.file;
  if (!file && fields.file !== undefined) {
    file = { data: decodeFileString(fields.file), filename: "file" };
  }
  delete fields.file;
  if (file && file.data.length > opts.maxFileBytes) throw new FormError(opts.tooLargeMessage);
  return { fields, file };
}

function decodeFileString(value: string): Buffer {
  if (/^(https?|ftp|s3|gs):/i.test(value)) {
    // Real Cloudinary fetches remote URLs. The fake refuses: it must not reach the network,
    // and a server that fetches URLs chosen by a client is a request-forgery hole.
    throw new FormError("Remote file URLs are not fetched by the local Cloudinary fake; upload the bytes instead");
  }
  const match = /^data:([^,]*?),(.*)$/s.exec(value);
  if (!match) throw new FormError("Invalid file parameter: expected a file part or a data: URI");
  const isBase64 = /;base64$/i.test(match[1]);
  try {
    return isBase64 ? Buffer.from(match[2], "base64") : Buffer.from(decodeURIComponent(match[2]), "utf8");
  } catch {
    throw new FormError("Invalid data: URI in file parameter");
  }
}

function readMultipart(req: IncomingMessage, opts: ReadFormOptions): Promise<UploadForm> {
  return new Promise((resolve, reject) => {
    let bb: busboy.Busboy;
    try {
      bb = busboy({
        headers: req.headers,
        limits: {
          fileSize: opts.maxFileBytes,
          files: 1,
          fields: MAX_FIELDS,
          fieldSize: maxDataUriChars(opts.maxFileBytes),
        },
      });
    } catch {
      req.resume();
      reject(new FormError("Malformed multipart body"));
      return;
    }

    const fields: Record<string, string> = {};
    let file: UploadFile | undefined;
    let failure: FormError | undefined;
    const fail = (err: FormError) => {
      failure ??= err;
    };

    bb.on("field", (name, value, info) => {
      if (info.valueTruncated) {
        fail(name === "file" ? new FormError(opts.tooLargeMessage) : new FormError(`Parameter ${name} is too long`));
        return;
      }
      if (name !== "file" && value.length > MAX_PLAIN_FIELD_BYTES) {
        fail(new FormError(`Parameter ${name} is too long`));
        return;
      }
      fields[name] = value;
    });

    bb.on("file", (name, stream, info) => {
      if (name !== "file") {
        stream.resume();
        return;
      }
      const chunks: Buffer[] = [];
      stream.on("data", (chunk: Buffer) => chunks.push(chunk));
      // Past the limit busboy discards the rest of the part, so memory stays bounded.
      stream.on("limit", () => fail(new FormError(opts.tooLargeMessage)));
      stream.on("end", () => {
        if (!stream.truncated) file = { data: Buffer.concat(chunks), filename: info.filename || "file" };
      });
    });

    bb.on("fieldsLimit", () => fail(new FormError("Too many parameters")));
    bb.on("filesLimit", () => fail(new FormError("Only one file may be uploaded per request")));
    bb.on("error", () => reject(failure ?? new FormError("Malformed multipart body")));
    bb.on("close", () => (failure ? reject(failure) : resolve({ fields, file })));
    req.pipe(bb);
  });
}

function readUrlencoded(req: IncomingMessage, opts: ReadFormOptions): Promise<UploadForm> {
  // Percent-encoding can triple a base64 body, so the cap is generous but still finite.
  const limit = maxDataUriChars(opts.maxFileBytes) * 3 + MAX_FIELDS * MAX_PLAIN_FIELD_BYTES;
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    let tooBig = false;
    req.on("data", (chunk: Buffer) => {
      size += chunk.length;
      if (size > limit) tooBig = true;
      else chunks.push(chunk);
    });
    req.on("error", () => reject(new FormError("Request body could not be read")));
    req.on("end", () => {
      if (tooBig) {
        reject(new FormError(opts.tooLargeMessage));
        return;
      }
      const fields: Record<string, string> = {};
      for (const [k, v] of new URLSearchParams(Buffer.concat(chunks).toString("utf8"))) fields[k] = v;
      resolve({ fields });
    });
  });
}
