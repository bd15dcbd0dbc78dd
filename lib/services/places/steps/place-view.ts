import "server-only";
import type { PlaceHit } from "@/db/places";
import { placeLabel } from "@/lib/geo/place-terms";
import type { Place } from "@/lib/validation/places";

/** A place found, as the API gives it: its label, and where it came from. */
export const placeView = (p: PlaceHit, source: Place["source"]): Place => ({ ...p, label: placeLabel(p), source });
