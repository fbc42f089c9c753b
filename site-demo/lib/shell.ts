/** The small HTML frame around every page of the demo site, and the index that lists the pages. */

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({'&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;'})[c]!)
}

export function pageShell(page: {siteName: string; title: string; body: string}): string {
  return frame(`${page.title} · ${page.siteName}`, page.siteName, `<article>\n${page.body}\n</article>`)
}

export function indexShell(site: {siteName: string; pages: ReadonlyArray<{name: string; title: string; diagrams: number}>}): string {
  const items = site.pages
    .map((p) => {
      const count = `${p.diagrams} ${p.diagrams === 1 ? 'diagram' : 'diagrams'}`
      return `  <li><a href="${escapeHtml(encodeURIComponent(p.name))}.html">${escapeHtml(p.title)}</a> <span class="count">${count}</span></li>`
    })
    .join('\n')
  const body = `<article>
<h1>${escapeHtml(site.siteName)}</h1>
<p>The working handbook of an invented seed-lending cooperative. Every drawing on these pages is
written as text in the Markdown source and checked when the site is built.</p>
<ul class="pages">
${items}
</ul>
</article>`
  return frame(site.siteName, site.siteName, body)
}

function frame(title: string, siteName: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="color-scheme" content="light dark">
<title>${escapeHtml(title)}</title>
<link rel="stylesheet" href="style.css">
</head>
<body>
<header class="site"><nav><a href="index.html">${escapeHtml(siteName)}</a></nav></header>
<main>
${body}
</main>
</body>
</html>
`
}
