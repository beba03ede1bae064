-- Headless Neovim (Debian's 0.7.2) as a real third-party LSP client of `rungs lsp --stdio`.
-- Usage: nvim --headless -u NONE -i NONE -n -c 'luafile tests/editors/nvim-client.lua' FILE
-- Env: RUNGS_BIN (server/bin/rungs.js), OUT (result file), HOVER_LINE/HOVER_COL (0-based),
-- FIX_LINE (0-based line whose quick fix is applied). Writes DIAG/HOVER/LINE records to OUT.
local out = assert(io.open(os.getenv('OUT'), 'w'))
local function log(...) out:write(table.concat(vim.tbl_map(tostring, {...}), '\t'), '\n'); out:flush() end

local ok, err = pcall(function()
  local bufnr = vim.api.nvim_get_current_buf()
  vim.bo[bufnr].filetype = 'rungs'  -- -u NONE: no filetype detection
  local client_id = vim.lsp.start_client({
    name = 'rungs',
    cmd = { 'node', os.getenv('RUNGS_BIN'), 'lsp', '--stdio' },
    root_dir = vim.fn.fnamemodify(vim.api.nvim_buf_get_name(bufnr), ':h'),
    settings = { rungs = { inlayHints = { enabled = true } } },
  })
  assert(client_id, 'start_client returned nil')
  assert(vim.lsp.buf_attach_client(bufnr, client_id), 'buf_attach_client failed')
  assert(vim.wait(15000, function()
    local c = vim.lsp.get_client_by_id(client_id); return c ~= nil and c.initialized == true
  end, 20), 'LSP client did not initialize')

  assert(vim.wait(15000, function() return #vim.diagnostic.get(bufnr) > 0 end, 20), 'no diagnostics')
  for _, d in ipairs(vim.diagnostic.get(bufnr)) do
    local raw = d.user_data and d.user_data.lsp or {}
    local code = d.code or raw.code or ''
    log('DIAG', d.lnum, d.col, d.severity, code, (d.message:gsub('\n', ' ')))
  end

  local pos = { line = tonumber(os.getenv('HOVER_LINE')), character = tonumber(os.getenv('HOVER_COL')) }
  local res = vim.lsp.buf_request_sync(bufnr, 'textDocument/hover',
    { textDocument = vim.lsp.util.make_text_document_params(bufnr), position = pos }, 10000)
  local r = assert(res and res[client_id] and res[client_id].result, 'no hover result')
  log('HOVER-BEGIN'); out:write(r.contents.value or vim.inspect(r.contents), '\n'); log('HOVER-END')

  local line = tonumber(os.getenv('FIX_LINE'))
  local actions = vim.lsp.buf_request_sync(bufnr, 'textDocument/codeAction', {
    textDocument = vim.lsp.util.make_text_document_params(bufnr),
    range = { start = { line = line, character = 1 }, ['end'] = { line = line, character = 1 } },
    context = { diagnostics = vim.lsp.diagnostic.get_line_diagnostics(bufnr, line) },
  }, 10000)
  local list = assert(actions and actions[client_id] and actions[client_id].result, 'no code actions')
  local chosen
  for _, a in ipairs(list) do
    log('ACTION', a.kind or '', a.title)
    if not chosen and a.kind == 'quickfix' and a.edit then chosen = a end
  end
  assert(chosen, 'no quick fix offered')
  vim.lsp.util.apply_workspace_edit(chosen.edit, 'utf-16')
  log('APPLIED', chosen.title)
  for i, l in ipairs(vim.api.nvim_buf_get_lines(bufnr, 0, -1, false)) do log('LINE', i - 1, l) end
  vim.lsp.stop_client(client_id)
end)

if ok then log('RESULT', 'PASS') else log('RESULT', 'FAIL', err) end
out:close()
vim.cmd(ok and 'qall!' or 'cquit! 1')
