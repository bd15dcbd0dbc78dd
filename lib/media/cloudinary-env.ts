// Imported before the Cloudinary SDK, never after: the SDK reads CLOUDINARY_URL when it is
// first loaded and picks http or https for uploads from its upload_prefix right then
// (cloudinary 2.11.0 lib/uploader.js). Without a value it would aim at the real service, so
// the local fake's address (the README's default) is filled in first.

export { LOCAL_CLOUDINARY_URL } from "@/lib/env";
import { fillCloudinaryUrl } from "@/lib/env";

fillCloudinaryUrl();
