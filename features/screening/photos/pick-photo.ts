import * as ImagePicker from 'expo-image-picker';

export type PickedPhoto = { uri: string; width: number; height: number; file?: File; mimeType?: string; fileName?: string };

/**
 * Camera or library through expo-image-picker. On the web target both open the file chooser (a phone
 * browser offers the camera there). Resolves null when the tester cancels.
 */
export async function pickPhoto(source: 'camera' | 'library'): Promise<PickedPhoto | null> {
  if (source === 'camera') {
    const permission = await ImagePicker.requestCameraPermissionsAsync();
    if (!permission.granted) throw new Error('Squadline may not use the camera. Allow it in the phone settings, or choose a photo instead.');
  }
  const options: ImagePicker.ImagePickerOptions = { mediaTypes: ['images'], quality: 0.9, allowsEditing: false, exif: false };
  const result = source === 'camera' ? await ImagePicker.launchCameraAsync(options) : await ImagePicker.launchImageLibraryAsync(options);
  const asset = result.canceled ? null : result.assets?.[0];
  if (!asset) return null;
  return {
    uri: asset.uri,
    width: asset.width,
    height: asset.height,
    file: asset.file,
    mimeType: asset.mimeType ?? undefined,
    fileName: asset.fileName ?? undefined,
  };
}
