/**
 * Shows an e-mail's HTML without letting it act: a sandboxed frame (no scripts, no access to
 * this page or its cookies) and a content policy that blocks every outside request, so a
 * message cannot load remote images or trackers. Links may still open in a new tab.
 */
const FRAME_HEAD =
  '<meta http-equiv="Content-Security-Policy" content="default-src \'none\'; img-src data: cid:; style-src \'unsafe-inline\'; font-src data:">' +
  '<base target="_blank">' +
  '<style>body{font-family:system-ui,sans-serif;color:#26221d;background:#fff;margin:1rem;line-height:1.5;word-wrap:break-word}</style>';

export function HtmlPreview({ html, title }: { html: string; title: string }) {
  return (
    <iframe
      title={title}
      srcDoc={FRAME_HEAD + html}
      sandbox="allow-popups allow-popups-to-escape-sandbox"
      referrerPolicy="no-referrer"
      className="h-[28rem] w-full rounded-lg border border-paper-edge bg-white"
    />
  );
}
