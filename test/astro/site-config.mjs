// The Astro configuration of the test site, as a function so the test can build the same site with
// other plugin options or another pages folder. Nothing here is specific to the test: a real site adds
// the two remark plugins to `markdown.remarkPlugins` in the same way.
import remarkDirective from 'remark-directive'
import remarkUpright from 'remark-upright'

/**
 * @param {{onFailure?: 'fail' | 'warn', srcDir?: string}} [options]
 * @returns {import('astro').AstroUserConfig}
 */
export function siteConfig(options = {}) {
  return {
    srcDir: options.srcDir ?? './src',
    // No integrations, no images, no fonts: the build needs nothing from the network.
    integrations: [],
    markdown: {
      remarkPlugins: [remarkDirective, [remarkUpright, {onFailure: options.onFailure ?? 'fail'}]]
    }
  }
}
