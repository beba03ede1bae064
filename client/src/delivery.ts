// Paced-delivery commands of the editor: export the rung's cue track, make its model audio, open
// its practice page. The language server writes the files beside the script (the same renderers
// as the `rungs` command); this side picks the rung under the cursor and offers to open the result.
import { accessSync, constants } from 'node:fs';
import { delimiter, join } from 'node:path';
import * as vscode from 'vscode';
import { ExecuteCommandRequest, type LanguageClient } from 'vscode-languageclient/node';
import { EXPORT_CUES_COMMAND, MAKE_AUDIO_COMMAND, PRACTICE_PAGE_COMMAND, type DeliveryResult } from '../../server/src/lsp/contract';
import { rungLineAt } from './present';
import { LadderRequest } from './protocol';

/** True when espeak-ng is on PATH: the audio command is shown only then. */
export function espeakFound(): boolean {
  return (process.env.PATH ?? '').split(delimiter).some((dir) => {
    if (!dir) return false;
    try {
      accessSync(join(dir, 'espeak-ng'), constants.X_OK);
      return true;
    } catch {
      return false;
    }
  });
}

type Kind = 'cues' | 'audio' | 'practice';
const SERVER_COMMAND: Record<Kind, string> = { cues: EXPORT_CUES_COMMAND, audio: MAKE_AUDIO_COMMAND, practice: PRACTICE_PAGE_COMMAND };
const BUSY: Record<Kind, string> = { cues: 'writing the cue track', audio: 'making model audio with espeak-ng', practice: 'writing the practice page' };

export async function runDelivery(client: LanguageClient, editor: vscode.TextEditor, kind: Kind): Promise<void> {
  const uri = client.code2ProtocolConverter.asUri(editor.document.uri);
  const ladder = await client.sendRequest(LadderRequest, { uri });
  const line = rungLineAt(ladder, editor.selection.active.line);
  if (line === null) {
    void vscode.window.showInformationMessage('Rungs: put the cursor in a rung (below its == header) first.');
    return;
  }
  const r = await vscode.window.withProgress(
    { location: vscode.ProgressLocation.Notification, title: `Rungs: ${BUSY[kind]}` },
    () => client.sendRequest(ExecuteCommandRequest.type, { command: SERVER_COMMAND[kind], arguments: [uri, line] }) as Promise<DeliveryResult | null>,
  );
  if (!r?.ok || !r.path) {
    void vscode.window.showWarningMessage(`Rungs: ${r?.message ?? 'the language server could not do this'}`);
    return;
  }
  const target = vscode.Uri.file(r.path);
  const action = kind === 'cues' ? 'Open' : kind === 'audio' ? 'Show Folder' : 'Open in Browser';
  const choice = await vscode.window.showInformationMessage(`Rungs: ${r.message}.`, action);
  if (!choice) return;
  if (kind === 'cues') await vscode.window.showTextDocument(target);
  else if (kind === 'audio') await vscode.commands.executeCommand('revealFileInOS', target);
  else await vscode.env.openExternal(target);
}
