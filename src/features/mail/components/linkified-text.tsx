import { Fragment } from 'react';

// Only web links become clickable; anything else (javascript:, data:) stays plain text.
const URL_PATTERN = /\bhttps?:\/\/[^\s<>"'`]+/gi;
const TRAILING_PUNCTUATION = /[.,;:!?)\]}>]+$/;

export type TextPart = { kind: 'text'; text: string } | { kind: 'link'; href: string };

/** Splits plain text into text and links, leaving sentence punctuation outside the link. */
export function splitLinks(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index ?? 0;
    const href = match[0].replace(TRAILING_PUNCTUATION, '');
    if (start > last) parts.push({ kind: 'text', text: text.slice(last, start) });
    parts.push({ kind: 'link', href });
    last = start + href.length;
  }
  if (last < text.length) parts.push({ kind: 'text', text: text.slice(last) });
  return parts;
}

export function LinkifiedText({ text }: { text: string }) {
  return (
    <>
      {splitLinks(text).map((part, index) =>
        part.kind === 'link' ? (
          <a key={index} href={part.href} target="_blank" rel="noopener noreferrer" className="break-all">
            {part.href}
          </a>
        ) : (
          <Fragment key={index}>{part.text}</Fragment>
        ),
      )}
    </>
  );
}
