// Toolgate's own line icons, drawn on a 24 x 24 grid (stroke, round caps and joins).
// Add an icon by adding its path data here; keep the same stroke style.
const circle = (cx: number, cy: number, r: number) => `M${cx - r} ${cy}a${r} ${r} 0 1 0 ${2 * r} 0a${r} ${r} 0 1 0 ${-2 * r} 0`;
const dot = (x: number, y: number) => `M${x} ${y}v.01`;

export const iconPaths = {
  // navigation
  inbox: ['M3 13.5L6 5h12l3 8.5V19a1 1 0 0 1-1 1H4a1 1 0 0 1-1-1z', 'M3 13.5h5.5l1.5 2.5h4l1.5-2.5H21'],
  requests: ['M9 3.5h6v3H9z', 'M9 5H6a1 1 0 0 0-1 1v14a1 1 0 0 0 1 1h12a1 1 0 0 0 1-1V6a1 1 0 0 0-1-1h-3', 'M8.5 11h7', 'M8.5 14.5h7', 'M8.5 18h4'],
  tool: ['M3 5h18v6H3z', 'M3 13h18v6H3z', 'M9.5 11a2.5 2.5 0 0 1 5 0', 'M9.5 13a2.5 2.5 0 0 0 5 0', 'M6 8v.01', 'M18 16v.01'],
  product: ['M12 3l8 4.5v9L12 21l-8-4.5v-9z', 'M4 7.5l8 4.5 8-4.5', 'M12 12v9', 'M8 5.3l8 4.4'],
  person: [circle(12, 8, 4), 'M4.5 20.5a7.5 7.5 0 0 1 15 0'],
  people: [circle(9, 8, 3.5), 'M2.5 20a6.5 6.5 0 0 1 13 0', 'M15.5 4.6a3.5 3.5 0 0 1 0 6.8', 'M18 14a6.5 6.5 0 0 1 3.5 6'],
  'person-add': [circle(10, 8, 4), 'M3 20.5a7 7 0 0 1 14 0', 'M19 8v6', 'M16 11h6'],
  shield: ['M12 3l7 3v5c0 4.5-3 8.2-7 10-4-1.8-7-5.5-7-10V6z', 'M9 12l2 2 4-4'],
  'sign-out': ['M10 4H6a1 1 0 0 0-1 1v14a1 1 0 0 0 1 1h4', 'M15 8l4 4-4 4', 'M19 12H9'],
  gate: ['M5 21V6', 'M2.5 21h5', 'M5 9h16v3.5H5z', 'M10 9l-2 3.5', 'M15 9l-2 3.5', 'M20 9l-2 3.5'],
  factory: ['M3 20V10.5l5 3v-3l5 3V4h5v16z', 'M2 20h20', 'M15.5 8v.01'],
  tag: ['M3.5 3.5h8l9 9-8 8-9-9z', circle(8, 8, 1.5)],
  globe: [circle(12, 12, 9), 'M3 12h18', 'M12 3c2.5 2.6 3.8 5.6 3.8 9s-1.3 6.4-3.8 9c-2.5-2.6-3.8-5.6-3.8-9s1.3-6.4 3.8-9z'],
  mail: ['M3 5.5h18v13H3z', 'M3.5 6.5l8.5 6.5 8.5-6.5'],
  // arrows and actions
  'chevron-right': ['M9 5l7 7-7 7'],
  'chevron-left': ['M15 5l-7 7 7 7'],
  'chevron-down': ['M5 9l7 7 7-7'],
  'arrow-right': ['M5 12h14', 'M13 6l6 6-6 6'],
  plus: ['M12 5v14', 'M5 12h14'],
  check: ['M5 12.5l4.5 4.5L19 7.5'],
  close: ['M6 6l12 12', 'M18 6L6 18'],
  search: [circle(11, 11, 6.5), 'M20 20l-4.3-4.3'],
  edit: ['M4 20h4L19 9l-4-4L4 16z', 'M13.5 6.5l4 4'],
  refresh: ['M20 12a8 8 0 1 1-2.3-5.7', 'M20 4v4h-4'],
  upload: ['M12 16V4', 'M7 9l5-5 5 5', 'M4 20h16'],
  image: ['M3 4.5h18v15H3z', circle(8.5, 9.5, 1.5), 'M21 16l-5-5-9 8.5'],
  lock: ['M5 11h14v10H5z', 'M8 11V7.5a4 4 0 0 1 8 0V11', 'M12 15v2'],
  eye: ['M2 12s3.5-7 10-7 10 7 10 7-3.5 7-10 7S2 12 2 12z', circle(12, 12, 3)],
  'eye-off': ['M2 12s3.5-7 10-7 10 7 10 7-3.5 7-10 7S2 12 2 12z', circle(12, 12, 3), 'M4 4l16 16'],
  // states (always shown with a word)
  info: [circle(12, 12, 9), 'M12 11v6', dot(12, 7.5)],
  alert: [circle(12, 12, 9), 'M12 7v6.5', dot(12, 16.5)],
  warning: ['M12 3.5L21.5 20h-19z', 'M12 10v4.5', dot(12, 17.3)],
  clock: [circle(12, 12, 9), 'M12 7v5l3.5 2'],
  returned: ['M9 6L5 10l4 4', 'M5 10h9.5a5 5 0 0 1 0 10H11'],
  irreversible: ['M9 6L5 10l4 4', 'M5 10h9.5a5 5 0 0 1 0 10H11', 'M3.5 3.5l17 17'],
  done: [circle(12, 12, 9), 'M8 12.5l3 3 5-6'],
  open: [circle(12, 12, 8)],
  inactive: [circle(12, 12, 9), 'M8 12h8'],
  offline: ['M2 8.5a15 15 0 0 1 20 0', 'M5 12a10 10 0 0 1 14 0', 'M8.5 15.5a5 5 0 0 1 7 0', dot(12, 19), 'M3 3l18 18'],
} satisfies Record<string, string[]>;

export type IconName = keyof typeof iconPaths;
