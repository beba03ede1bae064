// Moves an editor to a line of a document, opening it beside the views if needed: what a click
// on a point in the ladder or progress view does.
import * as vscode from 'vscode';

export async function revealLine(uri: vscode.Uri, line: number): Promise<void> {
  const visible = vscode.window.visibleTextEditors.find((e) => e.document.uri.toString() === uri.toString());
  const document = visible?.document ?? (await vscode.workspace.openTextDocument(uri));
  const editor = await vscode.window.showTextDocument(document, { viewColumn: visible?.viewColumn ?? vscode.ViewColumn.One, preserveFocus: false });
  const at = new vscode.Position(Math.min(Math.max(0, Math.floor(line)), document.lineCount - 1), 0);
  editor.selection = new vscode.Selection(at, at);
  editor.revealRange(new vscode.Range(at, at), vscode.TextEditorRevealType.InCenterIfOutsideViewport);
}
