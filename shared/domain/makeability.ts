/**
 * Can a product still be made? A product's bill of parts binds each part to the tool revision
 * whose geometry it needs (DESIGN.md section 3). A line can be molded when its tool still exists
 * (not disposed) and is at exactly that revision: a later revision means the geometry was cut
 * away by a change, and the part can no longer be molded from that tool.
 *
 * Tools that are being changed, or are past their rated life, do not block: they are warnings.
 */

export interface BillLineState {
  partName: string;
  toolCode: string;
  toolStatus: string;
  toolCurrentRevision: number;
  /** The revision whose geometry the product needs. */
  revision: number;
  lifeBand?: 'fresh' | 'worn' | 'spent';
  /** The caller may not see this tool (another factory's): report it without naming it. */
  hidden?: boolean;
}

export type BlockerKind = 'no_bill' | 'tool_disposed' | 'revision_superseded' | 'revision_not_made';

export interface Blocker {
  kind: BlockerKind;
  toolCode: string | null;
  partName: string | null;
  message: string;
}

export interface Makeability {
  canBeMade: boolean;
  reason: string;
  blockers: Blocker[];
  warnings: string[];
}

export function lineBlocker(line: BillLineState): Blocker | null {
  if (line.hidden) {
    const inner = lineBlocker({ ...line, hidden: false });
    return inner && { kind: inner.kind, toolCode: null, partName: null, message: 'A part molded on a tool at another factory cannot be made at the revision this product needs.' };
  }
  const { toolCode, partName } = line;
  if (line.toolStatus === 'disposed') {
    return { kind: 'tool_disposed', toolCode, partName, message: `Tool ${toolCode} is disposed, so part "${partName}" cannot be molded.` };
  }
  if (line.revision < line.toolCurrentRevision) {
    return {
      kind: 'revision_superseded',
      toolCode,
      partName,
      message: `Part "${partName}" needs tool ${toolCode} at revision ${line.revision}; the tool is now at revision ${line.toolCurrentRevision}, so that geometry is gone.`,
    };
  }
  if (line.revision > line.toolCurrentRevision) {
    return {
      kind: 'revision_not_made',
      toolCode,
      partName,
      message: `Part "${partName}" needs tool ${toolCode} at revision ${line.revision}, which has not been made yet (the tool is at revision ${line.toolCurrentRevision}).`,
    };
  }
  return null;
}

export function productMakeability(lines: readonly BillLineState[]): Makeability {
  if (lines.length === 0) {
    const message = 'No bill of parts is recorded, so nothing says which tools can make this product.';
    return { canBeMade: false, reason: message, blockers: [{ kind: 'no_bill', toolCode: null, partName: null, message }], warnings: [] };
  }
  const blockers = lines.map(lineBlocker).filter((b): b is Blocker => b !== null);
  const warnings: string[] = [];
  for (const l of lines) {
    if (lineBlocker(l) || l.hidden) continue;
    if (l.toolStatus === 'in_change') warnings.push(`Tool ${l.toolCode} is being changed; check the change before planning a run.`);
    if (l.lifeBand === 'spent') warnings.push(`Tool ${l.toolCode} is past its rated life.`);
    else if (l.lifeBand === 'worn') warnings.push(`Tool ${l.toolCode} has used more than 80 % of its rated life.`);
  }
  const uniqueWarnings = [...new Set(warnings)];
  if (blockers.length === 0) {
    const tools = new Set(lines.map((l) => (l.hidden ? `hidden:${l.toolCode}` : l.toolCode))).size;
    return {
      canBeMade: true,
      reason: `All ${lines.length} part${lines.length === 1 ? '' : 's'} can be molded from the current revision of ${tools} tool${tools === 1 ? '' : 's'}.`,
      blockers,
      warnings: uniqueWarnings,
    };
  }
  const more = blockers.length > 1 ? ` (and ${blockers.length - 1} more)` : '';
  return { canBeMade: false, reason: `${blockers[0]!.message}${more}`, blockers, warnings: uniqueWarnings };
}
