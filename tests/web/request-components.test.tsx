// The pieces of the request screens that carry the warning: words and icons, never colour alone.
import { fireEvent, render, screen } from '@testing-library/react';
import { computeImpact } from '@shared/domain/impact';
import { safetyReview } from '@shared/domain/safety';
import { ImageCompare } from '@/features/requests/components/image-compare';
import { ImpactPanel } from '@/features/requests/components/impact-panel';
import { IrreversibleBanner } from '@/features/requests/components/irreversible-banner';
import { CannotUndoPill, RequestStatusPill } from '@/components/requests/request-status';
import { SafetyCautions } from '@/features/requests/components/safety-cautions';

const tool = { id: 't1', code: 'KB-T-0412', currentRevision: 1 };
const parts = [{ id: 'p-head', toolId: 't1', name: 'Head' }];
const products = [{ id: 'kite', sku: 'SR-1001', name: 'Ranger Kite', status: 'reissue_planned' as const, plannedUnits: 40000 }];
const billOfParts = [{ productId: 'kite', partId: 'p-head', toolId: 't1', revision: 1, quantityPerUnit: 1 }];

describe('the cannot-be-undone warning', () => {
  it('when a change ends a product, then the banner says so in words and names the product with its planned units', () => {
    render(<IrreversibleBanner toolCode="KB-T-0412" ended={[{ id: 'kite', sku: 'SR-1001', name: 'Ranger Kite', plannedUnits: 40000 }]} />);
    const banner = screen.getByTestId('irreversible-banner');
    expect(banner.getAttribute('role')).toBe('alert');
    expect(banner.textContent).toContain('This change cannot be undone');
    expect(banner.textContent).toContain('Steel taken out of tool KB-T-0412 cannot be put back');
    expect(screen.getByTestId('irreversible-banner-product-SR-1001').textContent).toContain('Ranger Kite');
    expect(banner.textContent).toContain('40,000 planned units');
  });

  it('when the change only welds, then the words speak of welding, and the warning stays', () => {
    render(<IrreversibleBanner toolCode="KB-T-0520" ended={[]} removesSteel={false} />);
    const banner = screen.getByTestId('irreversible-banner');
    expect(banner.textContent).toContain('This change cannot be undone');
    expect(banner.textContent).toContain('Welding changes the steel of tool KB-T-0520 for good');
    expect(banner.textContent).toContain('No product in line or planned still needs the changed parts');
  });

  it('when a state is shown, then it has a word as well as its colour', () => {
    render(
      <>
        <RequestStatusPill status="engineering_review" testID="s" />
        <CannotUndoPill testID="c" />
      </>,
    );
    expect(screen.getByTestId('s').textContent).toBe('With engineering');
    expect(screen.getByTestId('c').textContent).toBe('Cannot be undone');
  });
});

describe('ImpactPanel', () => {
  it('when the head is cut, then the panel lists the ended product and both ways to keep it', () => {
    const impact = computeImpact({ tool, items: [{ partId: 'p-head', effect: 'gains_plastic', method: 'cut' }], parts, products, billOfParts, movedProductIds: [] });
    render(<ImpactPanel impact={impact} toolCode="KB-T-0412" />);
    expect(screen.getByTestId('impact-banner').textContent).toContain('Ranger Kite');
    expect(screen.getByTestId('impact-ended-SR-1001').textContent).toContain('40,000 planned units');
    expect(screen.getByTestId('impact-way-new_insert').textContent).toContain('Replacement insert');
    expect(screen.getByTestId('impact-way-duplicate_tool').textContent).toContain('Duplicate tool');
    expect(screen.getByTestId('impact-item-1').textContent).toContain('Cannot be undone');
  });

  it('when the change goes on a replacement insert, then the panel says it can be undone and shows no warning', () => {
    const impact = computeImpact({ tool, items: [{ partId: 'p-head', effect: 'insert_swapped', method: 'new_insert' }], parts, products, billOfParts, movedProductIds: [] });
    render(<ImpactPanel impact={impact} toolCode="KB-T-0412" />);
    expect(screen.queryByTestId('impact-banner')).toBeNull();
    expect(screen.getByTestId('impact-reversible').textContent).toContain('This change can be undone');
    expect(screen.getByTestId('impact-unaffected-SR-1001').textContent).toContain('can be swapped back');
  });
});

describe('SafetyCautions', () => {
  it('when an item may create a small part, then the cylinder values and the closing deferral are shown', () => {
    render(<SafetyCautions review={safetyReview([{ safetyFlags: ['small_part'] }])} />);
    // 16 CFR 1501.4 Figure 1: inside diameter 1.25 in (31.75 mm exactly from 25.4 mm per inch).
    expect(screen.getByTestId('safety-ref-spc_inside_diameter').textContent).toContain('1.25 in (31.75 mm)');
    expect(screen.getByTestId('safety-closing').textContent).toContain('accredited toy-safety laboratory');
  });

  it('when nothing is flagged, then nothing is shown', () => {
    const { container } = render(<SafetyCautions review={safetyReview([{ safetyFlags: [] }])} />);
    expect(container.textContent).toBe('');
  });
});

describe('ImageCompare', () => {
  const img = (name: string) => ({ uri: `/img/${name}`, width: 640, height: 480, name });

  it('when both images exist, then they show side by side with the item mark on its image, and the overlay can be stepped', () => {
    render(<ImageCompare before={img('b.png')} after={img('a.png')} marks={[{ role: 'after', label: '1', mark: { shape: 'box', x: 0.3, y: 0.2, w: 0.4, h: 0.1 } }]} />);
    expect(screen.getByTestId('image-compare-before')).toBeTruthy();
    expect(screen.getByTestId('image-compare-after-mark-1')).toBeTruthy();
    expect(screen.queryByTestId('image-compare-before-mark-1')).toBeNull();
    fireEvent.click(screen.getByTestId('image-compare-mode-overlay'));
    expect(screen.getByTestId('image-compare-overlay-value').textContent).toContain('50 %');
    fireEvent.click(screen.getByTestId('image-compare-overlay-less'));
    expect(screen.getByTestId('image-compare-overlay-value').textContent).toContain('40 %');
  });

  it('when the after image is missing, then its place says so in words', () => {
    render(<ImageCompare before={img('b.png')} after={null} marks={[]} />);
    expect(screen.getByTestId('image-compare-after-missing').textContent).toContain('No after image yet');
  });
});
