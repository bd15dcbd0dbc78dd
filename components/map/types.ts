export interface LatLng {
  lat: number;
  lng: number;
}

export interface MapMarker extends LatLng {
  id: string;
  label?: string;
  /** A visiting order number drawn on the marker. */
  order?: number;
  tone?: "listing" | "origin" | "selected";
  onSelect?: () => void;
  /** Class on the marker's SVG path, so a page (or a test) can find a listing's marker. */
  className?: string;
}

export interface MapProps {
  center: LatLng;
  zoom?: number;
  markers?: MapMarker[];
  /** A drawn outline (vertices in order); closed when it has three or more. */
  polygon?: LatLng[];
  /** A route drawn as straight segments. */
  line?: LatLng[];
  onClick?: (p: LatLng) => void;
  /** Points the view should fit when they change. */
  fitTo?: LatLng[];
  /** Where the view should go when this changes (a place found by name). */
  view?: LatLng & { zoom?: number };
  /**
   * Drawing without a mouse: a cross in the middle of the map and a button that places a
   * point there. Arrow keys move the map (once it has the focus), + and − zoom.
   */
  centrePick?: { label: string; onPick: (p: LatLng) => void };
  /** Accessible name of the map region. */
  label: string;
  className?: string;
}

/** The demo town's centre, where maps open when nothing else is known. */
export const DEFAULT_CENTER: LatLng = { lat: 52.205, lng: 0.847 };
