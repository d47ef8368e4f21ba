/** "240 KB", "3.4 MB": sizes as people read them (binary units, as file managers show them). */
export function formatBytes(n: number): string {
  if (n < 1024) return `${n} bytes`
  if (n < 1024 * 1024) return `${Math.round(n / 1024)} KB`
  const mb = n / (1024 * 1024)
  return `${mb < 10 ? mb.toFixed(1).replace(/\.0$/, '') : Math.round(mb)} MB`
}

/** How the accepted types read to a person: "PNG, JPEG, WebP or GIF images and PDF drawings". */
export const ACCEPTED_WORDS = 'PNG, JPEG, WebP or GIF images, and PDF drawings'
