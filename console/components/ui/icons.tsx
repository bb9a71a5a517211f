import { cn } from '@console/utils/cn';

// Line icons drawn for the console on a 20 px grid; decorative, so always aria-hidden.
const paths = {
  overview: 'M3 16.5h14M5 13.5l3-4 3 2.5 4-6M5 4v9.5',
  members: 'M7.5 9a3 3 0 1 0 0-6 3 3 0 0 0 0 6ZM2.5 16.5c.6-2.8 2.6-4.5 5-4.5s4.4 1.7 5 4.5M13 4.2a2.6 2.6 0 0 1 0 5M14.5 12.3c1.5.6 2.5 2 2.9 4.2',
  key: 'M6.5 6.5a3.5 3.5 0 1 0 0 7 3.5 3.5 0 0 0 0-7ZM10 10h7.5M14.5 10v2.5M17 10v2',
  docs: 'M4 3.5h8.5l3.5 3.5v9.5H4zM12.5 3.5V7H16M7 10.5h6M7 13.5h4',
  external: 'M11 3.5h5.5V9M16.5 3.5 9 11M14 12v4.5H3.5V6H8',
  signOut: 'M8 16.5H4v-13h4M12 6.5l3.5 3.5-3.5 3.5M15.5 10H8',
  copy: 'M7 7h9.5v9.5H7zM13 7V3.5H3.5V13H7',
  check: 'M4 10.5 8 14.5 16 5.5',
  plus: 'M10 4v12M4 10h12',
  analyses: 'M3.5 4.5h13M3.5 9h6M3.5 13.5h6M3.5 16.5h4M11.5 16l2-5 1.5 3 1.5-2.5',
  compare: 'M3 16.5h14M3.5 12c3-6 5-6 7-2s4 2.5 6-4M3.5 9c3 2 5 4 7 2.5s4-5 6-5.5',
  usage: 'M3.5 16.5h13M5 16.5V11M8.5 16.5V7M12 16.5V9.5M15.5 16.5V4',
  stimulus: 'M2.5 10h2c1-5 2-5 3 0s2 5 3 0 1.5-4 2.2 0 1.2 3 1.8 0h3',
  webhook: 'M7.5 7.5a2.5 2.5 0 1 1 4.3 1.7L9 14M5 12.5a2.5 2.5 0 1 0 2.6 3.1h6M15 11.5a2.5 2.5 0 1 1-1.2 4.7L11 12',
  code: 'M7 6 3 10l4 4M13 6l4 4-4 4M11 4.5l-2 11',
  mail: 'M3 5h14v10H3zM3 5.5l7 5.5 7-5.5',
  production: 'M3 16.5h14M4.5 16.5v-3M7.5 16.5v-6M10.5 16.5v-8M13.5 16.5v-5M16 16.5v-2M3.5 6.5l4-2.5 3 2 5.5-3',
  calibration: 'M10 16.5a6.5 6.5 0 1 1 0-13 6.5 6.5 0 0 1 0 13ZM10 10l3-3M10 5.5v1M14.5 10h-1M5.5 10h1',
  mask: 'M2.5 7c3-1.5 5-1.5 7.5 0s4.5 1.5 7.5 0M2.5 13c3-1.5 5-1.5 7.5 0s4.5 1.5 7.5 0M5 10h10',
} as const;

export type IconName = keyof typeof paths;

export function Icon({ name, className }: { name: IconName; className?: string }) {
  return (
    <svg
      viewBox="0 0 20 20"
      aria-hidden="true"
      className={cn('size-5 shrink-0', className)}
      fill="none"
      stroke="currentColor"
      strokeWidth="1.5"
      strokeLinecap="round"
      strokeLinejoin="round"
    >
      <path d={paths[name]} />
    </svg>
  );
}
