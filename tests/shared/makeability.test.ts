import { handlingFor, HEAVY_TOOL_KG } from '../../shared/domain/handling';
import { productMakeability, type BillLineState } from '../../shared/domain/makeability';

const line = (o: Partial<BillLineState> = {}): BillLineState => ({
  partName: 'Head',
  toolCode: 'KB-T-0412',
  toolStatus: 'active',
  toolCurrentRevision: 1,
  revision: 1,
  lifeBand: 'fresh',
  ...o,
});

describe('productMakeability', () => {
  it('when every line is at its tool current revision, then it can be made', () => {
    const m = productMakeability([line(), line({ partName: 'Torso', toolCode: 'KB-T-0413', toolCurrentRevision: 2, revision: 2 })]);
    expect(m).toMatchObject({ canBeMade: true, blockers: [], warnings: [] });
    expect(m.reason).toBe('All 2 parts can be molded from the current revision of 2 tools.');
  });

  it('when a change moved the tool past the revision a line needs, then it cannot be made and names the part and revisions', () => {
    const m = productMakeability([line({ toolCurrentRevision: 2, revision: 1 })]);
    expect(m.canBeMade).toBe(false);
    expect(m.blockers).toEqual([
      {
        kind: 'revision_superseded',
        toolCode: 'KB-T-0412',
        partName: 'Head',
        message: 'Part "Head" needs tool KB-T-0412 at revision 1; the tool is now at revision 2, so that geometry is gone.',
      },
    ]);
  });

  it('when a tool is disposed, then its lines block; a tool being changed or worn only warns', () => {
    const m = productMakeability([
      line({ toolStatus: 'disposed' }),
      line({ toolCode: 'KB-T-0420', toolStatus: 'in_change', lifeBand: 'worn' }),
      line({ toolCode: 'KB-T-0530', lifeBand: 'spent' }),
    ]);
    expect(m.canBeMade).toBe(false);
    expect(m.blockers.map((b) => b.kind)).toEqual(['tool_disposed']);
    expect(m.warnings).toEqual([
      'Tool KB-T-0420 is being changed; check the change before planning a run.',
      'Tool KB-T-0420 has used more than 80 % of its rated life.',
      'Tool KB-T-0530 is past its rated life.',
    ]);
  });

  it('when a blocking line is on a tool the caller may not see, then the blocker does not name it', () => {
    const m = productMakeability([line(), line({ toolCode: 'KB-T-SECRET', partName: 'Wing', toolStatus: 'disposed', hidden: true })]);
    expect(m.canBeMade).toBe(false);
    expect(m.blockers[0]).toMatchObject({ toolCode: null, partName: null });
    expect(JSON.stringify(m)).not.toMatch(/SECRET|Wing/);
  });

  it('when there is no bill of parts, then it cannot be made', () => {
    expect(productMakeability([])).toMatchObject({ canBeMade: false, blockers: [{ kind: 'no_bill' }] });
  });
});

describe('handlingFor', () => {
  it('when a tool weighs 50 kg or more, or its weight is unknown, then the rigging caution is raised', () => {
    // 50 kg: plates over 50 kg need lifting holes (firstratemold.com design rule, TRADE-FACTS 8).
    expect(HEAVY_TOOL_KG).toBe(50);
    expect(handlingFor(49.9).heavy).toBe(false);
    expect(handlingFor(50).heavy).toBe(true);
    expect(handlingFor(null)).toMatchObject({ heavy: true, weightKnown: false });
    // The caution wording comes from TRADE-FACTS 8 and defers to local codes and qualified riggers.
    expect(handlingFor(380).caution).toMatch(/OSHA 29 CFR 1910\.179\/\.184\/\.178 and ASME B30.*qualified riggers/);
  });
});
