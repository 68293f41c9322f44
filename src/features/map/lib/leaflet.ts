// Leaflet with its plugins, for the map page only (this module is in the lazily loaded map
// chunk, never on the home page).
//
// Leaflet's ES module build is a frozen namespace and sets no global, while geoman is
// written against a global, extensible `L`. So the plugins get a copy of the
// namespace as `window.L`; the classes inside are the very ones react-leaflet uses, so the
// plugins' additions (Map init hooks, FeatureGroup subclasses) reach every map.
import * as Leaflet from 'leaflet';
import 'leaflet/dist/leaflet.css';

declare global {
  interface Window {
    L?: typeof Leaflet;
  }
}

export const L: typeof Leaflet = (window.L ??= { ...Leaflet } as typeof Leaflet);
