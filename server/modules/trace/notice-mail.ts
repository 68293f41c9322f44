// The words of a plant-health notice: what was found, on which plant, which of the grower's
// wood may carry it, what to look for, and to contact the local plant-health authority.
// Heelwood advises and records; it does not certify.
import type { ExposedBundle, ExposedPlant, ExposureFinding } from '../../../shared/schemas/trace.js';
import type { OutgoingMail } from '../mail/mailer.js';

/** One notice per finding and grower, ever. */
export const noticeKey = (findingId: string, growerId: string) => `health-notice:${findingId}:${growerId}`;

const day = (iso: string | null) =>
  iso ? new Date(`${iso}T12:00:00Z`).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }) : 'an unknown date';

export function healthNoticeMail(p: {
  to: string;
  growerId: string;
  growerName: string;
  plant: { code: string; farmName: string; speciesName: string; varietyName: string | null };
  finding: ExposureFinding;
  since: string | null;
  bundles: ExposedBundle[];
  raised: ExposedPlant[];
  note?: string;
  publicUrl: string;
}): OutgoingMail {
  const f = p.finding;
  const pest = f.pest.scientificName && f.pest.scientificName !== f.pest.name ? `${f.pest.name} (${f.pest.scientificName})` : f.pest.name;
  const plant = `${p.plant.code} at ${p.plant.farmName} (${p.plant.speciesName}${p.plant.varietyName ? ` '${p.plant.varietyName}'` : ''})`;
  const text = [
    `Hello ${p.growerName},`,
    '',
    `${pest} was recorded on ${day(f.inspectedOn)} on mother plant ${plant}, severity ${f.severity}.${f.notes ? ` Inspector's note: ${f.notes}` : ''}`,
    'It can travel in cutting wood. The plant is on hold: no wood is taken from it.',
    '',
    p.since
      ? `Wood you received from that plant, or from plants raised from it, since it was last inspected clean on ${day(p.since)}:`
      : 'Wood you received from that plant, or from plants raised from it (it has no clean inspection on record before the finding):',
    ...p.bundles.map(
      (b) => `- Bundle ${b.code ?? '(no code)'}: ${b.cuttings} cuttings from plant ${b.fromPlantCode} (${b.farmName}), ${b.seasonName}, collected ${day(b.collectedOn)}`,
    ),
    ...(p.raised.length
      ? ['', 'Plants registered in Heelwood as raised from that wood:', ...p.raised.map((x) => `- ${x.code} at ${x.farmName}`)]
      : []),
    '',
    'What to look for:',
    f.pest.signs || 'See the advice of your local plant-health authority.',
    '',
    'What to do:',
    ...(f.pest.advice ? [f.pest.advice] : []),
    '- Check the cuttings and any plants raised from them; keep them apart from other stock until you have.',
    '- Do not give away, sell or offer wood or plants from them until they have been inspected and found clean; record that inspection in Heelwood.',
    '- Contact your local plant-health authority for advice on this finding. Some pests and diseases must be reported, and rules on moving plant material differ from place to place.',
    ...(p.note ? ['', `A note from your coordinator: ${p.note}`] : []),
    '',
    'Heelwood advises and keeps the cooperative\'s records; it does not certify plant health.',
    p.publicUrl,
    '',
    '— Heelwood, for your fruit-growing cooperative',
  ].join('\n');
  return {
    kind: 'health_notice',
    to: p.to,
    subject: `Plant-health notice: ${f.pest.name} on a plant your wood came from`,
    text,
    dedupeKey: noticeKey(f.id, p.growerId),
    related: { findingId: f.id, growerId: p.growerId, plantCode: p.plant.code, bundleIds: p.bundles.map((b) => b.id) },
  };
}
