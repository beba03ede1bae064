// What the benchmark needs from the server, bundled to dist/bench-core.js by the build.
export { analyze } from '../../server/src/core/analyze';
export { loadWordTable } from '../../server/src/data/wordTable';
export { lint } from '../../server/src/rules/index';
export { balanceSets } from '../../server/src/core/balance';
export { makeModelAudio } from '../../server/src/speech/makeAudio';
export { ESPEAK, findOnPath } from '../../server/src/speech/espeak';
export { makePace } from '../../server/src/core/pace';
// The pronunciation estimator and its comparison (tests/bench/pronounce.mjs).
export { parseModels, modelBytes } from '../../server/src/core/g2p/model';
export { DECOMPRESS_CHUNK, IMAGE_FILE } from '../../server/src/data/pronounceModel';
export { readModelImage } from '../../server/src/core/g2p/modelImage';
export { estimateCandidates } from '../../server/src/core/g2p/estimator';
export { decode } from '../../server/src/core/g2p/decode';
export { letterToSound } from '../../server/src/core/lts/letterToSound';
export { estimatePronunciation } from '../../server/src/core/lts/estimate';
export { score as scorePronunciations } from './pronounceEval';
export { PSEUDOWORDS } from './pseudowords';
// The language server's edit path without the protocol (tests/bench/editPath.mjs).
export { AnalysisStore } from '../../server/src/lsp/documents';
export { diagnosticsOf, messageBytes } from '../../server/src/lsp/diagnostics';
export { TextDocument } from 'vscode-languageserver-textdocument';
