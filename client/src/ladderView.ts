// The ladder view: a webview beside the editor that draws the current script's difficulty ladder,
// redraws when the server has analysed a new version, and moves the editor to an item on click.
// One panel follows the active Rungs editor, the way a preview follows its source.
import type { LanguageClient } from 'vscode-languageclient/node';
import { FollowingView } from './followingView';
import { renderLadderBody, renderLadderPage } from './ladderHtml';
import { LadderRequest } from './protocol';

export const LADDER_VIEW_TYPE = 'rungs.ladder';

export class LadderView extends FollowingView {
  constructor(getClient: () => LanguageClient | undefined) {
    super(getClient, {
      viewType: LADDER_VIEW_TYPE,
      title: 'Ladder',
      language: 'rungs',
      body: async (client, uri) => renderLadderBody(await client.sendRequest(LadderRequest, { uri: client.code2ProtocolConverter.asUri(uri) })),
      page: renderLadderPage,
    });
  }
}
