import type { ThemeConfig } from 'ant-design-vue/es/config-provider/context'

/**
 * Binwright's brass-and-slate look, set through ant-design-vue's theme tokens.
 * Contrast (WCAG 2.1): white on brass #7a5312 is 6.4:1, slate ink #1f2b31 on paper #fbfaf6 is 14:1,
 * shortage red #b3261e on paper is 6.3:1 — all above the AA 4.5:1 for body text.
 * ant-design-vue's default secondary greys (45 % and 25 % black) fall below 4.5:1 on paper, so
 * descriptions, placeholders, empty-table text and disabled values use `muted` (6.0:1 on paper)
 * and `faint` (4.8:1), checked with axe-core in tests/e2e/a11y.test.ts.
 */
export const palette = {
  brass: '#7a5312',
  brassLight: '#c9a25a',
  slate: '#2b3a42',
  ink: '#1f2b31',
  paper: '#fbfaf6',
  shortage: '#b3261e',
  ok: '#2e6b3a',
  caution: '#8a5a00',
  muted: '#5a646a',
  faint: '#666d71',
}

export const FONT_FAMILY = "'Noto Sans', system-ui, -apple-system, 'Segoe UI', sans-serif"

export const theme: ThemeConfig = {
  token: {
    colorPrimary: palette.brass,
    colorLink: palette.brass,
    colorText: palette.ink,
    colorError: palette.shortage,
    colorSuccess: palette.ok,
    colorWarning: palette.caution,
    colorBgLayout: palette.paper,
    colorTextSecondary: palette.muted,
    colorTextDescription: palette.muted,
    colorTextTertiary: palette.muted,
    colorTextPlaceholder: palette.faint,
    colorTextDisabled: palette.faint,
    colorTextQuaternary: palette.faint,
    borderRadius: 4,
    fontFamily: FONT_FAMILY,
    fontSize: 15,
  },
  components: {
    Layout: { colorBgHeader: palette.slate, colorBgBody: palette.paper },
    Menu: { colorItemBg: palette.slate },
  },
}
