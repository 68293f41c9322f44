import { L } from './leaflet-plugins';
import '@geoman-io/leaflet-geoman-free';
import '@geoman-io/leaflet-geoman-free/dist/leaflet-geoman.css';

// Only layers created with { pmIgnore: false } get geoman's editing: 10,000 plant markers
// must not each carry an editor.
L.PM.setOptIn(true);
