// The status bar item for the item under the cursor: its difficulty and its projected duration at
// the rung's first pace. A click opens the ladder view. Hidden outside Rungs editors and on lines
// that are not items.
import * as vscode from 'vscode';
import type { LanguageClient } from 'vscode-languageclient/node';
import { describeItem } from './present';
import { ItemAtRequest, type ItemAt } from './protocol';

export class ItemStatus implements vscode.Disposable {
  private readonly item: vscode.StatusBarItem;
  private readonly disposables: vscode.Disposable[] = [];
  private timer: ReturnType<typeof setTimeout> | undefined;
  private generation = 0;

  constructor(private readonly getClient: () => LanguageClient | undefined) {
    this.item = vscode.window.createStatusBarItem('rungs.item', vscode.StatusBarAlignment.Right, 100);
    this.item.name = 'Rungs: item under the cursor';
    this.item.command = 'rungs.showLadder';
    this.disposables.push(
      this.item,
      vscode.window.onDidChangeActiveTextEditor(() => this.schedule(0)),
      vscode.window.onDidChangeTextEditorSelection((e) => {
        if (e.textEditor === vscode.window.activeTextEditor) this.schedule(120);
      }),
    );
  }

  /** Called for every `rungs/didAnalyze`: the numbers under the cursor may have changed. */
  onDidAnalyze(uri: string): void {
    if (vscode.window.activeTextEditor?.document.uri.toString() === uri) this.schedule(0);
  }

  /** Coalesces bursts of cursor moves into one request. */
  schedule(delay: number): void {
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.update(), delay);
  }

  private async update(): Promise<void> {
    const editor = vscode.window.activeTextEditor;
    const client = this.getClient();
    const gen = ++this.generation;
    if (!editor || editor.document.languageId !== 'rungs' || !client?.isRunning()) {
      this.item.hide();
      return;
    }
    let found: ItemAt | null = null;
    try {
      found = await client.sendRequest(ItemAtRequest, {
        uri: client.code2ProtocolConverter.asUri(editor.document.uri),
        line: editor.selection.active.line,
      });
    } catch {
      found = null;
    }
    if (gen !== this.generation) return;
    if (!found) {
      this.item.hide();
      return;
    }
    const { text, tooltip } = describeItem(found);
    this.item.text = text;
    this.item.tooltip = tooltip;
    this.item.accessibilityInformation = { label: tooltip, role: 'button' };
    this.item.show();
  }

  dispose(): void {
    if (this.timer) clearTimeout(this.timer);
    for (const d of this.disposables) d.dispose();
  }
}
