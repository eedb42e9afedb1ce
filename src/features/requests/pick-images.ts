// Picking photos: the library (several at once) or, on a phone, the camera. On the web both open
// the browser's file chooser (a phone's browser offers its camera there too).
import * as ImagePicker from 'expo-image-picker';
import { uploadFileFromAsset } from '@/api/upload';
import type { PickedFile } from './upload-queue';

export type PickResult = { ok: true; files: PickedFile[] } | { ok: false; message: string | null };

const toPicked = (a: ImagePicker.ImagePickerAsset): PickedFile => ({
  file: uploadFileFromAsset(a),
  fileName: a.fileName ?? a.file?.name ?? 'photo',
  size: a.fileSize ?? a.file?.size ?? null,
  previewUri: a.uri || null,
  width: a.width || null,
  height: a.height || null,
});

export async function pickImages(source: 'library' | 'camera'): Promise<PickResult> {
  try {
    if (source === 'camera') {
      const permission = await ImagePicker.requestCameraPermissionsAsync();
      if (!permission.granted) return { ok: false, message: 'Toolgate may not use the camera. Allow it in the phone settings, or pick a photo from the library.' };
      const res = await ImagePicker.launchCameraAsync({ mediaTypes: ['images'], quality: 0.9 });
      return res.canceled ? { ok: false, message: null } : { ok: true, files: res.assets.map(toPicked) };
    }
    const res = await ImagePicker.launchImageLibraryAsync({ mediaTypes: ['images'], allowsMultipleSelection: true, selectionLimit: 20, quality: 1 });
    return res.canceled ? { ok: false, message: null } : { ok: true, files: res.assets.map(toPicked) };
  } catch {
    return { ok: false, message: 'The photos could not be opened. Try again, or pick fewer at once.' };
  }
}
