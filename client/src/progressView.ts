// The progress view: a webview beside a rate records file that draws each client's ratio per
// session against the benefit mark, redraws when the server has re-read the file (live on edit),
// and moves the editor to a row on click. One panel follows the active records editor.
import type { LanguageClient } from 'vscode-languageclient/node';
import { FollowingView } from './followingView';
import { renderProgressBody, renderProgressPage } from './progressHtml';
import { ProgressRequest } from './protocol';

export const PROGRESS_VIEW_TYPE = 'rungs.progress';
export const RECORDS_LANGUAGE = 'rungs-records';

export class ProgressView extends FollowingView {
  constructor(getClient: () => LanguageClient | undefined) {
    super(getClient, {
      viewType: PROGRESS_VIEW_TYPE,
      title: 'Progress',
      language: RECORDS_LANGUAGE,
      body: async (client, uri) => renderProgressBody(await client.sendRequest(ProgressRequest, { uri: client.code2ProtocolConverter.asUri(uri) })),
      page: renderProgressPage,
    });
  }
}
