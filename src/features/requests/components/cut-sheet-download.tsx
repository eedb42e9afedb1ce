import { useState } from 'react';
import { Linking, StyleSheet, View } from 'react-native';
import { cutSheetUrl, type CutSheetPaper } from '@/api/requests';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { space } from '@/theme';

const papers = [
  { value: 'a4', label: 'A4' },
  { value: 'letter', label: 'US Letter' },
] as const;

export interface CutSheetDownloadProps {
  requestId: string;
  /** Before the request is cleared to cut, the sheet prints stamped "not for cutting". */
  cleared: boolean;
  testID?: string;
}

/** The cut sheet (PDF, English and Chinese) on the chosen paper. */
export function CutSheetDownload({ requestId, cleared, testID = 'cut-sheet' }: CutSheetDownloadProps) {
  const [paper, setPaper] = useState<CutSheetPaper>('a4');
  return (
    <View style={styles.box}>
      <ChoiceGroup label="Paper" options={papers} value={paper} onChange={setPaper} testID={`${testID}-paper`} />
      <Button title="Cut sheet (PDF)" icon="download" variant="secondary" onPress={() => void Linking.openURL(cutSheetUrl(requestId, paper))} testID={`${testID}-download`} />
      <AppText variant="small">
        {cleared
          ? 'The sheet the factory cuts from, in English and Chinese, with the sign-off record.'
          : 'Not cleared to cut yet: every page is stamped "not for cutting".'}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({ box: { gap: space.sm } });
