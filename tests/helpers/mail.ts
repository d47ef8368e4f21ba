/**
 * Just enough MIME to read what nodemailer sends (mailparser is not installed): headers with
 * encoded words, nested multipart bodies, base64 and quoted-printable parts.
 */
export interface ParsedMail {
  headers: Record<string, string>
  subject: string
  to: string
  text: string
  html: string
  attachments: { filename: string; contentType: string; content: Buffer }[]
}

const decodeQ = (s: string) => {
  const bytes: number[] = []
  for (let i = 0; i < s.length; i++) {
    if (s[i] === '=' && /^[0-9A-F]{2}$/i.test(s.slice(i + 1, i + 3))) { bytes.push(parseInt(s.slice(i + 1, i + 3), 16)); i += 2 } else bytes.push(s.charCodeAt(i))
  }
  return Buffer.from(bytes)
}

/** RFC 2047 encoded words, e.g. =?UTF-8?Q?Stores_alert=3A?= */
function decodeWords(v: string) {
  return v.replace(/\?=\s+=\?/g, '?==?').replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_m, _cs, enc: string, data: string) =>
    (enc.toUpperCase() === 'B' ? Buffer.from(data, 'base64') : decodeQ(data.replace(/_/g, ' '))).toString('utf8'))
}

function splitHead(raw: string) {
  const at = raw.search(/\r?\n\r?\n/)
  const head = at < 0 ? raw : raw.slice(0, at)
  const body = at < 0 ? '' : raw.slice(at).replace(/^\r?\n\r?\n/, '')
  const headers: Record<string, string> = {}
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const i = line.indexOf(':')
    if (i > 0) headers[line.slice(0, i).trim().toLowerCase()] = line.slice(i + 1).trim()
  }
  return { headers, body }
}

const param = (header: string, name: string) =>
  new RegExp(`${name}="?([^";]+)"?`, 'i').exec(header)?.[1]

function decodeBody(body: string, encoding = '') {
  const e = encoding.toLowerCase()
  if (e === 'base64') return Buffer.from(body.replace(/\s+/g, ''), 'base64')
  if (e === 'quoted-printable') return decodeQ(body.replace(/=\r?\n/g, ''))
  return Buffer.from(body, 'utf8')
}

function walk(raw: string, out: ParsedMail) {
  const { headers, body } = splitHead(raw)
  const type = headers['content-type'] ?? 'text/plain'
  if (/^multipart\//i.test(type)) {
    const boundary = param(type, 'boundary')!
    const parts = body.split(`--${boundary}`).slice(1)
    for (const part of parts) {
      if (part.startsWith('--')) break
      walk(part.replace(/^\r?\n/, ''), out)
    }
    return
  }
  const content = decodeBody(body, headers['content-transfer-encoding'])
  const disposition = headers['content-disposition'] ?? ''
  const filename = param(disposition, 'filename') ?? param(type, 'name')
  if (/attachment/i.test(disposition) || filename) {
    out.attachments.push({ filename: filename ?? '', contentType: type.split(';')[0].trim(), content })
  } else if (/^text\/html/i.test(type)) out.html += content.toString('utf8')
  else out.text += content.toString('utf8')
}

export function parseMail(raw: string): ParsedMail {
  const { headers } = splitHead(raw)
  const out: ParsedMail = {
    headers, subject: decodeWords(headers.subject ?? ''), to: decodeWords(headers.to ?? ''), text: '', html: '', attachments: [],
  }
  walk(raw, out)
  return out
}
