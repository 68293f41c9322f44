import type { Progress } from '../api/send-with-progress';

/** A bar while bytes go up, then words while the server works on them. */
export function UploadProgress({ progress, noun, processingLabel }: { progress: Progress | null; noun: string; processingLabel: string }) {
  if (!progress) return null;
  if (progress.phase === 'processing') {
    return (
      <div role="status" className="flex flex-col gap-1.5">
        <span className="text-sm font-medium">{processingLabel}</span>
        {/* No value: an indeterminate bar, since the server does not say how far it is. */}
        <progress className="h-3 w-full accent-leaf" aria-label={processingLabel} />
      </div>
    );
  }
  const percent = Math.round(progress.fraction * 100);
  return (
    <div role="status" className="flex flex-col gap-1.5">
      <span className="text-sm font-medium">
        Sending the {noun}: {percent} %
      </span>
      <progress className="h-3 w-full accent-leaf" max={100} value={percent} aria-label={`Sending the ${noun}`} />
    </div>
  );
}
