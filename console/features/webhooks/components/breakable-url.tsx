import { Fragment } from 'react';

/** A URL that wraps after its slashes and dots rather than mid-word; copying it still gives the plain text. */
export function BreakableUrl({ url }: { url: string }) {
  const parts = url.split(/(?<=[/.?&])/);
  return (
    <>
      {parts.map((part, index) => (
        <Fragment key={index}>
          {part}
          {index < parts.length - 1 && <wbr />}
        </Fragment>
      ))}
    </>
  );
}
