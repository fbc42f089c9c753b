import type {AstroUserConfig} from 'astro'

export interface SiteConfigOptions {
  /** remark-upright's failure mode (default `'fail'`). */
  onFailure?: 'fail' | 'warn'
  /** Astro's source folder, relative to test/astro (default `'./src'`). */
  srcDir?: string
}

export declare function siteConfig(options?: SiteConfigOptions): AstroUserConfig
