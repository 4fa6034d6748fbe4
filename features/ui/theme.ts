import { FONT_FAMILY } from './font-family';

// Squadline's own palette: a deep pine for action, warm paper for surfaces, amber and brick for
// "watch" and "concern". High contrast for a bright sports hall.
export const colors = {
  ink: '#17212B',
  inkMuted: '#4A5663',
  paper: '#F6F4EF',
  surface: '#FFFFFF',
  line: '#D9D4C7',
  pine: '#0E5A45',
  pineDark: '#0A4334',
  pineSoft: '#DCEBE4',
  amber: '#8A5300',
  amberSoft: '#FBEBCB',
  brick: '#A8321F',
  brickSoft: '#F8DDD6',
  focus: '#2F6FDE',
} as const;

export const fonts = FONT_FAMILY;

export const space = { xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32 } as const;
export const radius = { sm: 6, md: 10, lg: 16 } as const;

/** Touch targets stay at least this tall: tapped one-handed, courtside. */
export const TOUCH_MIN = 48;

export const type = {
  title: { fontFamily: fonts.bold, fontSize: 26, lineHeight: 32, color: colors.ink },
  heading: { fontFamily: fonts.bold, fontSize: 20, lineHeight: 26, color: colors.ink },
  body: { fontFamily: fonts.regular, fontSize: 17, lineHeight: 24, color: colors.ink },
  label: { fontFamily: fonts.bold, fontSize: 15, lineHeight: 20, color: colors.ink },
  small: { fontFamily: fonts.regular, fontSize: 14, lineHeight: 19, color: colors.inkMuted },
} as const;
