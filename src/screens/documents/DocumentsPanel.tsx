/**
 * The documents of a site or feed: photos as a gallery of previews, other
 * files as a list, each with its size, type and who added it. On a phone
 * "Take photo" opens the camera (the web file input with capture, or
 * expo-image-picker in the native app); "Add file" picks any accepted file.
 */
import { createElement, useRef, useState } from 'react';
import { Image, Platform, StyleSheet, Text, View } from 'react-native';
import * as ImagePicker from 'expo-image-picker';
import type { DocumentInfo } from '@/shared/schemas/documents';
import { useDocumentActions, useDocuments, usePreview, type DocumentOwnerKind } from '@/src/api/queries/documents';
import { Button } from '@/src/components/Button';
import { Section } from '@/src/components/layout/Section';
import { describeError, EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { colors, radius, space, type } from '@/src/theme';
import { whenText } from '@/shared/format';
import { sizeText, typeText } from './describe';

interface Props {
  kind: DocumentOwnerKind;
  code: string;
  canEdit: boolean;
  /** "photos" shows the camera button first (sites); feeds list files only */
  photos?: boolean;
}

function Preview({ kind, code, doc }: { kind: DocumentOwnerKind; code: string; doc: DocumentInfo }) {
  const preview = usePreview(kind, code, doc.id, doc.preview);
  return (
    <View style={styles.thumb}>
      {preview.data ? (
        <Image source={{ uri: preview.data }} style={styles.image} accessibilityLabel={`Photo ${doc.name}`} testID={`doc-preview-${doc.id}`} resizeMode="cover" />
      ) : (
        <Text style={type.small}>{preview.error ? 'No preview' : 'Loading…'}</Text>
      )}
    </View>
  );
}

export function DocumentsPanel({ kind, code, canEdit, photos = false }: Props) {
  const docs = useDocuments(kind, code);
  const actions = useDocumentActions(kind, code);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const cameraInput = useRef<HTMLInputElement | null>(null);
  const fileInput = useRef<HTMLInputElement | null>(null);

  const send = async (file: Blob, name: string) => {
    setBusy(true);
    setMessage(null);
    try {
      const doc = await actions.upload(file, name);
      setMessage(`Added ${doc.name} (${sizeText(doc.size)}).`);
    } catch (e) {
      setMessage(`Not added: ${describeError(e)}`);
    } finally {
      setBusy(false);
    }
  };

  const onPicked = (e: { target: HTMLInputElement }) => {
    const file = e.target.files?.[0];
    e.target.value = '';
    if (file) void send(file, file.name);
  };

  const takePhoto = async () => {
    if (Platform.OS === 'web') return cameraInput.current?.click();
    const permission = await ImagePicker.requestCameraPermissionsAsync();
    if (!permission.granted) return setMessage('The camera is not allowed for Headwater; allow it in the phone settings.');
    const shot = await ImagePicker.launchCameraAsync({ mediaTypes: ['images'], quality: 0.8 });
    const asset = shot.canceled ? null : shot.assets[0];
    if (asset) await send(await (await fetch(asset.uri)).blob(), asset.fileName ?? `photo-${Date.now()}.jpg`);
  };

  const open = async (doc: DocumentInfo) => {
    try {
      const { url } = await actions.link(doc.id);
      if (Platform.OS === 'web') window.open(url, '_blank', 'noopener');
    } catch (e) {
      setMessage(`Could not open ${doc.name}: ${describeError(e)}`);
    }
  };

  const remove = async (doc: DocumentInfo) => {
    try {
      await actions.remove(doc.id);
      setMessage(`Deleted ${doc.name}.`);
    } catch (e) {
      setMessage(`Not deleted: ${describeError(e)}`);
    }
  };

  const items = docs.data?.items;
  const images = items?.filter((d) => d.preview) ?? [];
  const files = items?.filter((d) => !d.preview) ?? [];
  const hidden = { display: 'none' };

  return (
    <Section title={`Documents${items ? ` (${items.length})` : ''}`} note="Photos, surveys, licences, path profiles: JPEG, PNG, WebP, PDF, text or CSV, up to 25 MB each." testID="documents">
      {canEdit ? (
        <View style={styles.actions}>
          {photos ? <Button label="Take photo" onPress={() => void takePhoto()} busy={busy} testID="doc-take-photo" /> : null}
          <Button label="Add file" variant="secondary" onPress={() => fileInput.current?.click()} busy={busy} testID="doc-add-file" />
          {Platform.OS === 'web'
            ? [
                createElement('input', { key: 'camera', ref: cameraInput, type: 'file', accept: 'image/*', capture: 'environment', style: hidden, onChange: onPicked, 'data-testid': 'doc-camera-input' }),
                createElement('input', { key: 'file', ref: fileInput, type: 'file', accept: 'image/jpeg,image/png,image/webp,application/pdf,text/plain,text/csv,.csv,.txt', style: hidden, onChange: onPicked, 'data-testid': 'doc-file-input' }),
              ]
            : null}
        </View>
      ) : null}
      {message ? (
        <Text style={type.body} accessibilityLiveRegion="polite" testID="doc-message">
          {message}
        </Text>
      ) : null}
      {!items ? (
        docs.error ? (
          <ErrorState what="the documents" error={docs.error} onRetry={() => void docs.mutate()} />
        ) : (
          <LoadingState what="the documents" />
        )
      ) : items.length === 0 ? (
        <EmptyState title="No documents yet" message={canEdit ? 'Add a photo or a file above.' : 'Nobody has added one.'} testID="doc-empty" />
      ) : null}
      {images.length ? (
        <View style={styles.gallery} testID="doc-gallery">
          {images.map((d) => (
            <View key={d.id} style={styles.tile} testID={`doc-tile-${d.id}`}>
              <Preview kind={kind} code={code} doc={d} />
              <Text style={type.small} numberOfLines={1}>
                {d.name}
              </Text>
              <View style={styles.row}>
                <Button label="Open" variant="quiet" onPress={() => void open(d)} accessibilityLabel={`Open ${d.name}`} />
                {canEdit ? <Button label="Delete" variant="quiet" onPress={() => void remove(d)} accessibilityLabel={`Delete ${d.name}`} /> : null}
              </View>
            </View>
          ))}
        </View>
      ) : null}
      {files.map((d) => (
        <View key={d.id} style={styles.file} testID={`doc-file-${d.id}`}>
          <View style={styles.fileText}>
            <Text style={type.label}>{d.name}</Text>
            <Text style={type.small}>
              {typeText(d.type)}, {sizeText(d.size)}, added {whenText(d.createdAt)} by {d.createdBy || 'unknown'}
            </Text>
          </View>
          <Button label="Open" variant="secondary" onPress={() => void open(d)} accessibilityLabel={`Open ${d.name}`} />
          {canEdit ? <Button label="Delete" variant="quiet" onPress={() => void remove(d)} accessibilityLabel={`Delete ${d.name}`} /> : null}
        </View>
      ))}
    </Section>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginBottom: space.sm },
  gallery: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  tile: { width: 160, gap: space.xs },
  thumb: { width: 160, height: 120, borderRadius: radius.md, backgroundColor: colors.sunken, alignItems: 'center', justifyContent: 'center', overflow: 'hidden' },
  image: { width: 160, height: 120 },
  row: { flexDirection: 'row', gap: space.xs },
  file: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm, paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line },
  fileText: { flexGrow: 1, flexShrink: 1, minWidth: 200 },
});
