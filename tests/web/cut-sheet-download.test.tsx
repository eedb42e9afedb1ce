// The cut sheet button on the request detail: the paper the user picks goes into the address.
import { fireEvent, render, screen } from '@testing-library/react';
import { Linking } from 'react-native';
import { CutSheetDownload } from '@/features/requests/components/cut-sheet-download';

describe('cut sheet download', () => {
  it('when the user picks US Letter and presses the button, then the sheet opens on letter paper; A4 is the default', () => {
    const open = jest.spyOn(Linking, 'openURL').mockResolvedValue(true);
    render(<CutSheetDownload requestId="6c9b5a1e-0000-4000-8000-000000000001" cleared testID="cs" />);
    fireEvent.click(screen.getByTestId('cs-download'));
    expect(open).toHaveBeenLastCalledWith(expect.stringMatching(/\/api\/requests\/6c9b5a1e-0000-4000-8000-000000000001\/cut-sheet\.pdf\?paper=a4$/));
    fireEvent.click(screen.getByTestId('cs-paper-letter'));
    fireEvent.click(screen.getByTestId('cs-download'));
    expect(open).toHaveBeenLastCalledWith(expect.stringMatching(/cut-sheet\.pdf\?paper=letter$/));
    expect(screen.getByText('Cut sheet (PDF)')).toBeTruthy();
  });

  it('when the request is not cleared to cut, then the user is told the sheet is stamped', () => {
    render(<CutSheetDownload requestId="r1" cleared={false} testID="cs" />);
    expect(screen.getByText(/stamped "not for cutting"/)).toBeTruthy();
  });
});
