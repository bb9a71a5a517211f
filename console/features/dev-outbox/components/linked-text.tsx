import { Fragment } from 'react';

const LINK = /(https?:\/\/[^\s<>"]+)/g;

/** Plain text with every http(s) address made clickable, so a caught invitation can be followed from here. */
export function LinkedText({ text }: { text: string }) {
  const parts = text.split(LINK);
  return (
    <>
      {parts.map((part, index) =>
        index % 2 === 1 ? (
          <a key={index} href={part} className="break-all font-semibold text-ink-800 underline underline-offset-2 hover:text-signal-800">
            {part}
          </a>
        ) : (
          <Fragment key={index}>{part}</Fragment>
        ),
      )}
    </>
  );
}
