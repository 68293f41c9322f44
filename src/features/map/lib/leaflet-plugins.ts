// Imported after ./leaflet so that the global L exists when the plugin runs.
import { L } from './leaflet';
import 'leaflet.markercluster';
import 'leaflet.markercluster/dist/MarkerCluster.css';

export { L };
