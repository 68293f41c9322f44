// The map's Leaflet, for the map's components (geoman is added by ./geoman-plugin).
import { L } from './leaflet';

export { L };
