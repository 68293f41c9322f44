/** The short caution shown wherever wood is cut. */
export function OfferCaution() {
  return (
    <aside aria-labelledby="offer-caution-title" className="rounded-card border border-amber/50 bg-amber-light/60 p-5">
      <h2 id="offer-caution-title" className="mb-2 flex items-center gap-2 text-lg font-semibold">
        <svg width="18" height="18" viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="text-amber">
          <polygon points="10,1.5 19,18 1,18" fill="currentColor" />
          <rect x="9" y="7" width="2" height="6" fill="white" />
          <rect x="9" y="14.5" width="2" height="2" fill="white" />
        </svg>
        Before you cut
      </h2>
      <ul className="flex list-disc flex-col gap-1.5 pl-5">
        <li>Use sharp secateurs and cut away from your body and your other hand; carry them closed.</li>
        <li>Clean the blades between plants (a cloth with alcohol or disinfectant), so nothing travels from one plant to the next.</li>
        <li>Take wood only from healthy plants. Leave any shoot with swollen, round buds or dark tunnels in the pith, and tell the coordinator.</li>
      </ul>
      <p className="mt-3 text-sm text-ink-soft">Local plant-health rules come first. Heelwood advises and records; it does not certify.</p>
    </aside>
  );
}
