import { useState } from 'react';
import { Linking, Platform, StyleSheet, TextInput, View } from 'react-native';
import { describeError } from '@/components/account/form-errors';
import { QueryContent } from '@/components/account/query-states';
import { dateTimeText } from '@/components/library/library-format';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { colors, fonts, radius, spacing } from '@/components/ui/theme';
import { useMeQuery } from '@/lib/api/auth';
import {
  attachmentDownloadUrl,
  useAttachmentsQuery,
  useDeleteAttachmentMutation,
  useUploadAttachmentMutation,
  type PickedFile,
} from '@/lib/api/exchange';
import { ATTACHMENT_MAX_BYTES, type Attachment } from '@/lib/schemas/exchange';
import { roleAtLeast } from '@/lib/schemas/groups';
import type { ComplexDetail } from '@/lib/schemas/library';
import { attachmentKindLabel, fileSizeText, shortSha, uploadRefusalText } from './exchange-format';
import { FilePickButton } from './file-picker';

/** What the server allows (attachment.service): the entry's author or a curator uploads; curators delete. */
function attachmentRights(entry: Pick<ComplexDetail, 'myRole' | 'createdBy' | 'status'>, userId: string | undefined) {
  const curator = roleAtLeast(entry.myRole, 'curator');
  const author = roleAtLeast(entry.myRole, 'contributor') && !!userId && entry.createdBy?.id === userId;
  return { canUpload: (curator || author) && entry.status !== 'retired', canDelete: curator };
}

/** Files on a library entry (spectra, structures, raw data): list, upload and, for curators, delete. */
export function AttachmentsPanel({ entry }: { entry: Pick<ComplexDetail, 'id' | 'myRole' | 'createdBy' | 'status'> }) {
  const me = useMeQuery();
  const query = useAttachmentsQuery(entry.id);
  const rights = attachmentRights(entry, me.data?.user.id);
  return (
    <Card title="Files" testID="attachments-panel">
      <QueryContent query={query} loadingLabel="Loading files…" errorTitle="The files could not be loaded" testID="attachments">
        {(attachments) =>
          attachments.length === 0 ? (
            <AppText tone="muted" testID="attachments-empty">No files yet. Spectra, CIF structures and raw data can be attached here.</AppText>
          ) : (
            <View style={styles.list}>
              {attachments.map((attachment, i) => (
                <AttachmentRow key={attachment.id} attachment={attachment} index={i} complexId={entry.id} canDelete={rights.canDelete} />
              ))}
            </View>
          )
        }
      </QueryContent>
      {rights.canUpload ? <UploadForm complexId={entry.id} /> : null}
    </Card>
  );
}

function AttachmentRow({ attachment, index, complexId, canDelete }: { attachment: Attachment; index: number; complexId: string; canDelete: boolean }) {
  const [confirming, setConfirming] = useState(false);
  const remove = useDeleteAttachmentMutation(complexId);
  const url = attachmentDownloadUrl(attachment);
  const web = Platform.OS === 'web';
  const anchor = { href: url, hrefAttrs: { download: attachment.fileName } };
  return (
    <View style={styles.row} testID={`attachment-row-${index}`}>
      <View style={styles.rowMain}>
        <AppText
          {...anchor}
          accessibilityRole="link"
          onPress={web ? undefined : () => void Linking.openURL(url)}
          style={styles.fileLink}
          testID={`attachment-download-${index}`}
        >
          {attachment.fileName}
        </AppText>
        <AppText variant="caption" tone="muted">
          {attachmentKindLabel[attachment.kind]} · {fileSizeText(attachment.sizeBytes)} · SHA-256 {shortSha(attachment.sha256)}…
        </AppText>
        {attachment.description ? <AppText variant="caption">{attachment.description}</AppText> : null}
        {attachment.state !== 'accepted' ? (
          <AppText variant="caption" tone="muted" testID={`attachment-state-${index}`}>
            {attachment.state === 'pending' ? 'Waits for review with this entry’s revision' : 'Declined with its revision; kept for the author and curators'}
          </AppText>
        ) : null}
        <AppText variant="caption" tone="muted">
          Added by {attachment.uploadedBy?.displayName ?? 'someone no longer in the group'} · {dateTimeText(attachment.createdAt)}
        </AppText>
        {remove.isError ? <AppText variant="caption" tone="danger" testID={`attachment-delete-${index}-error`}>{describeError(remove.error)}</AppText> : null}
      </View>
      {canDelete ? (
        confirming ? (
          <View style={styles.confirm}>
            <AppText variant="caption">Delete this file for everyone?</AppText>
            <View style={styles.buttons}>
              <Button label="Delete" onPress={() => remove.mutate(attachment.id)} disabled={remove.isPending} testID={`attachment-delete-${index}-confirm`} />
              <Button label="Keep" kind="quiet" onPress={() => setConfirming(false)} testID={`attachment-delete-${index}-cancel`} />
            </View>
          </View>
        ) : (
          <Button label="Delete" kind="quiet" onPress={() => setConfirming(true)} testID={`attachment-delete-${index}`} accessibilityLabel={`Delete ${attachment.fileName}`} />
        )
      ) : null}
    </View>
  );
}

function UploadForm({ complexId }: { complexId: string }) {
  const [file, setFile] = useState<PickedFile | null>(null);
  const [description, setDescription] = useState('');
  const upload = useUploadAttachmentMutation(complexId);
  const tooLarge = !!file && file.sizeBytes > ATTACHMENT_MAX_BYTES;
  const send = () => {
    if (!file) return;
    upload.mutate(
      { file, description },
      {
        onSuccess: () => {
          setFile(null);
          setDescription('');
        },
      },
    );
  };
  return (
    <View style={styles.upload} testID="attachments-upload">
      <AppText variant="label" tone="muted">Attach a file</AppText>
      <View style={styles.buttons}>
        <FilePickButton
          label={file ? 'Choose another file' : 'Choose a file'}
          accept=".pdf,.png,.jpg,.jpeg,.zip,.xlsx,.docx,.pptx,.odt,.ods,.cif,.jdx,.dx,.jcamp,.csv,.tsv,.txt,.dat,.asc,.xy"
          onPick={(picked) => {
            setFile(picked);
            upload.reset();
          }}
          testID="attachments-pick"
        />
        {file ? <AppText style={styles.mono} testID="attachments-file-name">{file.name} · {fileSizeText(file.sizeBytes)}</AppText> : null}
      </View>
      {file ? (
        <>
          <TextInput
            value={description}
            onChangeText={setDescription}
            placeholder="What is it? (optional), e.g. UV-vis in 1 M HClO4, 298 K"
            placeholderTextColor={colors.muted}
            maxLength={500}
            accessibilityLabel="Description of the file"
            testID="attachments-description"
            style={styles.input}
          />
          {tooLarge ? <FormError message={`This file is ${fileSizeText(file.sizeBytes)}; files of up to 20 MB can be attached.`} testID="attachments-too-large" /> : null}
          <View style={styles.buttons}>
            <Button label={upload.isPending ? 'Uploading…' : 'Upload'} onPress={send} disabled={tooLarge || upload.isPending} testID="attachments-upload-send" />
          </View>
        </>
      ) : null}
      <FormError message={upload.isError ? uploadRefusalText(upload.error) : null} testID="attachments-upload-error" />
      <FormError tone="done" message={upload.isSuccess ? `Attached ${upload.data.fileName}.` : null} testID="attachments-upload-done" />
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-start', gap: spacing.md, paddingVertical: spacing.sm, borderTopWidth: 1, borderTopColor: colors.line },
  rowMain: { flex: 1, minWidth: 220, gap: 2 },
  fileLink: { fontFamily: fonts.strong, color: colors.accent, textDecorationLine: 'underline' },
  confirm: { gap: spacing.xs, alignItems: 'flex-end' },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm },
  upload: { gap: spacing.sm, paddingTop: spacing.sm, borderTopWidth: 1, borderTopColor: colors.line },
  mono: { fontFamily: fonts.mono },
  input: {
    fontFamily: fonts.body,
    fontSize: 15,
    color: colors.ink,
    backgroundColor: colors.card,
    borderWidth: 1.5,
    borderColor: colors.lineStrong,
    borderRadius: radius.md,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.sm,
  },
});
