/**
 * Parse a Markdown file the way a site with directives enabled would, for tools (the CLI) that read
 * files outside a unified pipeline.
 */
import type {Root} from 'mdast'
import {directiveFromMarkdown} from 'mdast-util-directive'
import {fromMarkdown} from 'mdast-util-from-markdown'
import {directive} from 'micromark-extension-directive'

export function parseMarkdown(text: string): Root {
  return fromMarkdown(text, {extensions: [directive()], mdastExtensions: [directiveFromMarkdown()]})
}
