/**
 * Certificates in the user's vocabulary (vertex ids as written, edges directed as written): what the
 * CLI prints as JSON and what a reviewer can re-check by hand.
 */
export type UserEdge = [string, string]

/**
 * With a cycle, nonplanar or not-upward failure: the edges whose removal the message suggests
 * (explain/suggest-fix.ts), and whether no smaller set does it.
 */
export interface CertificateFix {
  remove: UserEdge[]
  exact: boolean
}

export type Certificate = CertificateKind & {fix?: CertificateFix}

export type CertificateKind =
  | {kind: 'cycle'; vertices: string[]}
  | {kind: 'kuratowski'; type: 'K5' | 'K3,3'; branch: string[]; edges: UserEdge[]}
  | {kind: 'obstruction'; edges: UserEdge[]}
  /**
   * With tiers: `crossing` — these edges cannot be drawn on their levels without two crossing;
   * `path-against-tiers` — these edges, in order, lead from a tier through vertices in no tier back to
   * the same or an earlier tier.
   */
  | {kind: 'level'; problem: 'crossing' | 'path-against-tiers'; edges: UserEdge[]}

/**
 * Every outcome of checking one diagram. `upward` is the only passing one; `too-large` means a size
 * limit (limits.ts) was exceeded and the graph was not checked.
 */
export type DiagramStatus = 'upward' | 'cycle' | 'nonplanar' | 'not-upward' | 'syntax' | 'undecided' | 'too-large'
