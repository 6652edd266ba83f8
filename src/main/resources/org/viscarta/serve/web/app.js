// Viscarta workbench: the page. Talks only to the server that served it (same origin, its token in a cookie).
'use strict';
(function () {
  const $ = (id) => document.getElementById(id);
  // Okabe–Ito, as in the figures
  const COLOURS = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000'];
  const BANDS = ['rgba(0,114,178,0.18)', 'rgba(213,94,0,0.18)'];
  const state = { about: null, source: null, job: null, result: null, dataPath: '', plots: [], samples: [] };

  // --- small helpers -----------------------------------------------------------------------------

  async function api(method, url, body, isForm) {
    const opts = { method, credentials: 'same-origin', headers: {} };
    if (body !== undefined) {
      if (isForm) {
        opts.body = body;
      } else {
        opts.body = JSON.stringify(body);
        opts.headers['Content-Type'] = 'application/json';
      }
    }
    const r = await fetch(url, opts);
    const text = await r.text();
    let data = null;
    try { data = text ? JSON.parse(text) : null; } catch (e) { data = { error: text }; }
    if (!r.ok) {
      throw new Error((data && data.error) || ('the server answered ' + r.status));
    }
    return data;
  }

  function el(tag, props, ...children) {
    const e = document.createElement(tag);
    if (props) {
      for (const [k, v] of Object.entries(props)) {
        if (v === undefined || v === null || v === false) continue;
        if (k === 'text') e.textContent = v;
        else if (k === 'className') e.className = v;
        else if (k.startsWith('on')) e.addEventListener(k.substring(2), v);
        else e.setAttribute(k, v === true ? '' : v);
      }
    }
    for (const c of children.flat()) {
      if (c === null || c === undefined) continue;
      e.append(c instanceof Node ? c : document.createTextNode(String(c)));
    }
    return e;
  }

  function clear(node) { while (node.firstChild) node.removeChild(node.firstChild); return node; }

  // four significant digits, as the tables
  function fmt(v) {
    if (v === null || v === undefined || !isFinite(v)) return '–';
    const a = Math.abs(v);
    if (a !== 0 && (a >= 1e6 || a < 1e-4)) return v.toExponential(3).replace(/\.?0+e/, 'e').replace('e+', 'e');
    return String(Number(v.toPrecision(4)));
  }

  function modulusUnit(max) {
    for (const [f, u] of [[1e9, 'GPa'], [1e6, 'MPa'], [1e3, 'kPa']]) if (max >= f) return { f, u };
    return { f: 1, u: 'Pa' };
  }

  function status(node, text, bad) {
    node.textContent = text;
    node.classList.toggle('error', !!bad);
  }

  // --- tables from the server (same headers, units and formats as the workbook) -------------------

  function renderTable(t, into, opts) {
    opts = opts || {};
    if (!t) return;
    into.append(el('h3', { text: t.name }));
    if (t.intro) into.append(el('p', { text: t.intro }));
    if (!t.rows.length) {
      into.append(el('p', { className: 'hint', text: 'Nothing to list.' }));
    } else {
      const head = el('tr', null, t.headers.map(h => el('th', { scope: 'col', text: h })));
      const rows = t.rows.map(r => el('tr', null, r.map((c, i) => el('td', { className: t.numeric[i] ? 'n' : null, text: c }))));
      into.append(el('div', { className: 'scroll' }, el('table', { id: 'table-' + t.id }, el('thead', null, head), el('tbody', null, rows))));
    }
    if (t.notes && t.notes.length && !opts.noNotes) {
      into.append(el('ul', { className: 'statements' }, t.notes.map(n =>
        n.endsWith(':') && !n.startsWith(' ') ? el('li', { className: 'set', text: n.slice(0, -1) }) : el('li', { text: n.trim() }))));
    }
  }

  function tableById(id) { return state.result.tables.find(t => t.id === id); }

  // --- 1. files ------------------------------------------------------------------------------------

  async function filesFromDrop(dt) {
    const items = dt.items ? Array.from(dt.items) : [];
    const entries = items.map(i => i.webkitGetAsEntry && i.webkitGetAsEntry()).filter(Boolean);
    if (!entries.length) return Array.from(dt.files).map(f => ({ file: f, path: f.name }));
    const out = [];
    async function walk(entry, prefix) {
      if (entry.name.startsWith('.')) return;
      if (entry.isFile) {
        const f = await new Promise((res, rej) => entry.file(res, rej));
        out.push({ file: f, path: prefix + f.name });
      } else if (entry.isDirectory) {
        const reader = entry.createReader();
        let batch;
        do {
          batch = await new Promise((res, rej) => reader.readEntries(res, rej));
          for (const e of batch) await walk(e, prefix + entry.name + '/');
        } while (batch.length);
      }
    }
    for (const e of entries) await walk(e, '');
    return out;
  }

  async function upload(list) {
    list = list.filter(x => !x.path.split('/').some(p => p.startsWith('.')));
    if (!list.length) return;
    const form = new FormData();
    const seen = new Set();
    for (const x of list) {
      // files picked from several folders may share a name: keep each, the later ones renamed
      let path = x.path;
      for (let k = 2; seen.has(path); k++) {
        const dot = x.path.lastIndexOf('.');
        path = dot > 0 ? x.path.slice(0, dot) + '-' + k + x.path.slice(dot) : x.path + '-' + k;
      }
      seen.add(path);
      form.append('files', x.file, x.file.name);
      form.append('paths', path);
    }
    status($('files-status'), 'Sending ' + list.length + ' file(s) to the server on this computer…');
    try {
      const r = await api('POST', '/api/uploads', form, true);
      state.source = { upload: r.upload };
      status($('files-status'), r.files.length + ' file(s) received.');
      await inspect();
    } catch (e) {
      status($('files-status'), e.message, true);
    }
  }

  function readingSettings() {
    const columns = {};
    for (const line of $('columns').value.split('\n')) {
      const i = line.indexOf('=');
      if (i > 0) columns[line.slice(0, i).trim()] = line.slice(i + 1).trim();
    }
    return { modulus: $('modulus').value, basis: $('basis').value, poisson: $('poisson').value.trim(), columns,
      group_by: $('group-by').value.trim() };
  }

  async function inspect() {
    if (!state.source) return;
    status($('files-status'), 'Reading the files…');
    try {
      const r = await api('POST', '/api/inspect', Object.assign({ settings: readingSettings() }, state.source));
      renderInspection(r);
      const n = r.files.length;
      status($('files-status'), n + ' file(s) read' + (r.left_out.length ? ', ' + r.left_out.length + ' could not be read (see beside each)' : '') + '.', n === 0);
      $('run').disabled = n === 0;
      $('run-hint').textContent = n === 0 ? 'No file could be read.' : '';
    } catch (e) {
      status($('files-status'), e.message, true);
    }
  }

  function renderInspection(r) {
    $('inspection').hidden = false;
    const body = [];
    const samples = new Set();
    for (const f of r.files) {
      const cols = el('ul', null, f.columns.map(c => el('li', { text: "'" + c.header + "' → " + c.understood_as })));
      const sweeps = {};
      for (const s of f.sweeps) {
        samples.add(s.sample);
        const k = s.sample;
        sweeps[k] = sweeps[k] || { n: 0, points: 0, lo: Infinity, hi: -Infinity, basis: s.basis, t: s.temperature_c, test: s.test };
        sweeps[k].n++;
        sweeps[k].points += s.points;
        if (s.frequency_min_hz !== null) sweeps[k].lo = Math.min(sweeps[k].lo, s.frequency_min_hz);
        if (s.frequency_max_hz !== null) sweeps[k].hi = Math.max(sweeps[k].hi, s.frequency_max_hz);
      }
      const sw = el('ul', null, Object.entries(sweeps).map(([k, v]) => el('li', {
        text: k + ': ' + (v.test ? v.n + ' ' + v.test + ', ' : v.n + ' sweep(s), ') + v.points + ' points, ' + (isFinite(v.lo) ? fmt(v.lo) + '–' + fmt(v.hi) + ' Hz, ' : '') +
          v.basis + (v.t !== null && v.t !== undefined ? ', ' + fmt(v.t) + ' °C' : '') })));
      const warn = f.warnings.length ? el('ul', null, f.warnings.map(w => el('li', { text: w }))) : 'none';
      body.push(el('tr', null, el('td', { text: f.file }),
        el('td', { text: f.layout + '; ' + f.separator + '; header on line ' + f.header_line }), el('td', null, cols), el('td', null, sw),
        el('td', null, warn)));
    }
    for (const l of r.left_out) {
      body.push(el('tr', { className: 'left-out' }, el('td', { text: l.file }), el('td', { className: 'bad', colspan: '4', text: 'not read: ' + l.message })));
    }
    const head = el('tr', null, ['file', 'how it was read', 'columns understood', 'samples', 'warnings'].map(h => el('th', { scope: 'col', text: h })));
    clear($('inspection-table')).append(el('table', { id: 'table-inspection' }, el('thead', null, head), el('tbody', null, body)));
    const target = clear($('target'));
    target.append(el('option', { value: '', text: 'none' }));
    for (const s of Array.from(samples).sort()) target.append(el('option', { value: s, text: s }));
  }

  async function browseData(path) {
    try {
      const r = await api('GET', '/api/data?path=' + encodeURIComponent(path));
      state.dataPath = r.path;
      $('data-path').textContent = r.path || '.';
      const ul = clear($('data-folders'));
      for (const f of r.folders) {
        ul.append(el('li', null, el('button', { type: 'button', className: 'secondary', text: f + '/',
          onclick: () => browseData((r.path ? r.path + '/' : '') + f) })));
      }
      if (!r.folders.length) ul.append(el('li', { className: 'hint', text: r.files.length + ' file(s), no sub-folders' }));
    } catch (e) {
      status($('files-status'), e.message, true);
    }
  }

  // --- 2. run --------------------------------------------------------------------------------------

  function analysisSettings() {
    const s = readingSettings();
    Object.assign(s, {
      at: $('at').value.trim(), band: $('band').value.trim(), alpha: $('alpha').value.trim(), target: $('target').value,
      use_library: $('use-library').checked, reference_temperature: $('reference-temperature').value.trim(),
      vertical: $('vertical').value, temperature_tolerance: $('temperature-tolerance').value.trim(),
      within_groups: $('within-groups').checked, drop_outliers: $('drop-outliers').checked, weighting: $('weighting').value,
      models: Array.from(document.querySelectorAll('#models input:checked')).map(i => i.value)
    });
    return s;
  }

  async function run() {
    if (!state.source) return;
    $('run').disabled = true;
    $('progress-box').hidden = false;
    $('progress').value = 0;
    status($('progress-text'), 'Starting…');
    try {
      const job = await api('POST', '/api/analyses', Object.assign({ settings: analysisSettings() }, state.source));
      state.job = job.id;
      await poll(job.id);
    } catch (e) {
      status($('progress-text'), e.message, true);
    } finally {
      $('run').disabled = false;
    }
  }

  async function poll(id) {
    for (;;) {
      const s = await api('GET', '/api/analyses/' + id);
      $('progress').value = s.fraction;
      if (s.state === 'failed') {
        status($('progress-text'), 'The analysis stopped: ' + s.error, true);
        return;
      }
      if (s.state === 'done') {
        status($('progress-text'), 'Done in ' + s.seconds.toFixed(1) + ' s.');
        const r = await api('GET', '/api/analyses/' + id + '/result');
        showResults(r);
        return;
      }
      status($('progress-text'), s.stage + (s.steps > 0 ? ' (' + s.steps_done + ' of ' + s.steps + ')' : '') + '…');
      await new Promise(res => setTimeout(res, 250));
    }
  }

  // --- 3. results ----------------------------------------------------------------------------------

  function showResults(r) {
    state.result = r;
    $('results').hidden = false;
    $('what').textContent = r.what;
    $('demo').hidden = !r.demo;
    $('demo').textContent = r.demo || '';
    const cautions = clear($('cautions'));
    cautions.append(el('h3', { text: 'Cautions' }));
    for (const c of r.cautions) cautions.append(el('p', { text: c }));
    const base = '/api/analyses/' + r.id + '/files/';
    $('dl-xlsx').href = base + 'report.xlsx';
    $('dl-html').href = base + 'report.html';
    $('dl-figures').href = base + 'figures.zip';
    $('dl-all').href = base + 'all.zip';
    for (const a of ['dl-xlsx', 'dl-html', 'dl-figures', 'dl-all']) $(a).setAttribute('download', '');

    const ranking = clear($('view-ranking'));
    const rt = tableById('ranking');
    if (rt) renderTable(rt, ranking);
    else ranking.append(el('p', { text: 'No damping ranking: no frequency sweeps among the inputs.' }));
    const rankFigure = r.figures.find(f => f.name === 'damping-ranking');
    if (rankFigure) {
      ranking.append(el('figure', null, el('img', { src: '/api/analyses/' + r.id + '/figures/damping-ranking.png', alt: rankFigure.caption,
        className: 'figure', width: '900' }), el('figcaption', { text: rankFigure.caption })));
    }
    renderTable(tableById('summary'), ranking);
    if (r.warnings.length || r.notes.length) {
      ranking.append(el('h3', { text: 'Warnings and notes on the inputs' }),
        el('ul', null, r.notes.map(n => el('li', { text: n })), r.warnings.map(w => el('li', { text: w }))));
    }

    const pick = clear($('sample-pick'));
    r.samples.forEach((s, i) => pick.append(el('option', { value: String(i), text: s.name + (s.master_curve ? ' (master curve)' : '') })));
    if (r.samples.length) drawSample(r.samples[0]);

    const matches = clear($('view-matches'));
    const mt = tableById('reference-matches');
    const mm = tableById('mimic-ranking');
    if (mt) renderTable(mt, matches);
    if (mm) renderTable(mm, matches);
    if (!mt && !mm) matches.append(el('p', { text: 'No reference library was used and no target was chosen.' }));

    const temp = clear($('temperature-tables'));
    for (const s of r.series) {
      temp.append(el('h3', { text: 'Master curve of ' + s.sample + ' at ' + fmt(s.reference_c) + ' °C' }));
      const head = el('tr', null, ['temperature [°C]', 'log10 a_T', '± SE', 'b_T', 'placed'].map(h => el('th', { text: h })));
      const rows = s.factors.map(f => el('tr', null, el('td', { className: 'n', text: fmt(f.temperature_c) }),
        el('td', { className: 'n', text: fmt(f.log10_a_t) }), el('td', { className: 'n', text: fmt(f.log10_a_t_std_error) }),
        el('td', { className: 'n', text: fmt(f.b_t) }), el('td', { text: f.placed ? 'yes' : 'no' })));
      temp.append(el('table', null, el('thead', null, head), el('tbody', null, rows)), el('ul', { className: 'statements' }, s.notes.map(n => el('li', { text: n }))));
    }
    for (const id of ['transitions', 'activation-energy', 'transition-ranking']) renderTable(tableById(id), temp);
    if (!r.series.length && !r.ramps.length) temp.append(el('p', { text: 'No sweeps at several temperatures and no temperature ramps among the inputs.' }));
    $('ramp-box').hidden = !r.ramps.length;
    const rp = clear($('ramp-pick'));
    r.ramps.forEach((s, i) => {
      const reps = Array.from(new Set(s.ramps.map(x => x.replicate)));
      reps.forEach(rep => rp.append(el('option', { value: i + '|' + rep, text: s.sample + ', replicate ' + rep })));
    });
    if (r.ramps.length) drawRamp(rp.value);

    const quality = clear($('view-quality'));
    renderTable(tableById('quality'), quality);
    const gallery = clear($('view-figures'));
    renderTable(tableById('regions'), gallery);
    gallery.append(el('p', { className: 'hint', text: 'The report\'s figures (PNG at 200 dpi; the SVG of each is in the figures ZIP). '
      + 'Open one in a new tab to see it at full size.' }));
    for (const f of r.figures) {
      const src = '/api/analyses/' + r.id + '/figures/' + encodeURIComponent(f.name) + '.png';
      gallery.append(el('figure', null, el('a', { href: src, target: '_blank', rel: 'noopener' },
        el('img', { src, alt: f.caption, className: 'figure', loading: 'lazy', width: '900' })), el('figcaption', { text: f.caption })));
    }
        const readme = clear($('view-readme'));
    readme.append(el('dl', null, r.definitions.map(d => [el('dt', { text: d.term }), el('dd', { text: d.text })])));
    selectTab('tab-ranking');
    $('results').scrollIntoView({ behavior: 'smooth' });
  }

  function selectTab(id) {
    for (const t of document.querySelectorAll('[role=tab]')) {
      const on = t.id === id;
      t.setAttribute('aria-selected', on ? 'true' : 'false');
      t.tabIndex = on ? 0 : -1;
      $(t.getAttribute('aria-controls')).hidden = !on;
    }
    // plots drawn while hidden have no width: draw again
    if (id === 'tab-samples' && state.result && state.result.samples.length) drawSample(state.result.samples[Number($('sample-pick').value || 0)]);
    if (id === 'tab-temperature' && state.result && state.result.ramps.length) drawRamp($('ramp-pick').value);
  }

  // --- plots ---------------------------------------------------------------------------------------

  function width(node) { return Math.max(320, Math.min(1100, (node.parentElement.clientWidth || 900) - 10)); }

  function destroyPlots(keys) {
    state.plots = state.plots.filter(p => {
      if (keys.includes(p.key)) { p.plot.destroy(); return false; }
      return true;
    });
  }

  // one x axis for several series measured at different x: the union, each series null elsewhere
  function merge(seriesXY) {
    const xs = Array.from(new Set(seriesXY.flatMap(s => s.x))).sort((a, b) => a - b);
    const index = new Map(xs.map((x, i) => [x, i]));
    const data = [xs];
    for (const s of seriesXY) {
      const y = new Array(xs.length).fill(null);
      s.x.forEach((x, i) => { y[index.get(x)] = s.y[i]; });
      data.push(y);
    }
    return data;
  }

  function logTicks(unit) {
    return (u, splits) => splits.map(v => v === null ? '' : fmt(v));
  }

  function whiskers(pairs) {
    // draws mean ± SD bars: pairs = [{x, lo, hi, colour}]
    return (u) => {
      const ctx = u.ctx;
      ctx.save();
      ctx.lineWidth = 1;
      for (const p of pairs) {
        if (p.lo === null || p.hi === null) continue;
        const x = u.valToPos(p.x, 'x', true);
        const y1 = u.valToPos(p.lo, 'y', true);
        const y2 = u.valToPos(p.hi, 'y', true);
        ctx.strokeStyle = '#444';
        ctx.beginPath(); ctx.moveTo(x, y1); ctx.lineTo(x, y2); ctx.stroke();
      }
      ctx.restore();
    };
  }

  // a sample computed from stress relaxation or creep tests: its measured M(t) or J(t) and the model, log–log
  function drawTimeTest(s) {
    const tt = s.time_test;
    const relaxation = tt.unit === 'Pa';
    const sc = relaxation ? modulusUnit(Math.max(...tt.replicates.flatMap(r => r.value))) : { f: 1, u: '1/Pa' };
    const series = tt.replicates.map(r => ({ x: r.time_s, y: r.value.map(v => v / sc.f) }));
    const opts = tt.replicates.map((r, k) => ({ label: 'replicate ' + r.replicate + ' (measured)', stroke: COLOURS[k % 7], width: 0,
      paths: () => null, points: { show: true, size: 6, fill: COLOURS[k % 7] } }));
    if (tt.model) {
      series.push({ x: tt.model_time_s, y: tt.model_value.map(v => v / sc.f) });
      opts.push({ label: tt.model + ', fitted to all replicates', stroke: '#000', width: 2, spanGaps: true, points: { show: false } });
    }
    for (const o of opts) o.value = (u, v) => v === null || v === undefined ? '–' : fmt(v) + ' ' + sc.u;
    const node = clear($('plot-moduli'));
    const plot = new uPlot({
      title: s.name + ': the measured ' + tt.quantity + (tt.model ? ' and ' + tt.model + ' (best supported)' : ''),
      width: width(node), height: 380,
      scales: { x: { time: false, distr: 3 }, y: { distr: 3 } },
      axes: [{ label: 'time since the step [s]', values: logTicks() }, { label: tt.symbol + ' [' + sc.u + ']', values: logTicks(), size: 70 }],
      series: [{ label: 'time [s]', value: (u, v) => v === null ? '–' : fmt(v) + ' s' }].concat(opts)
    }, merge(series), node);
    state.plots.push({ key: 'moduli', plot });
    clear($('plot-residuals'));
    const about = clear($('sample-about'));
    about.append('Measured by ' + tt.test + ', not by oscillation: the E′ and E″ that rank and match it are computed from '
      + 'each replicate\'s fitted model.', el('ul', null, tt.origin.map(o => el('li', { text: o }))));
  }

  function drawSample(s) {
    destroyPlots(['moduli', 'residuals']);
    if (s.time_test) {
      drawTimeTest(s);
      return;
    }
    const m = s.measured;
    const L = s.letter;
    const sc = modulusUnit(Math.max(...m.storage_high_pa, ...m.loss_high_pa));
    const d = (arr) => arr.map(v => v / sc.f);
    const series = [{ x: m.frequency_hz, y: d(m.storage_pa) }, { x: m.frequency_hz, y: d(m.loss_pa) }];
    const opts = [
      { label: L + '′ measured (mean)', stroke: COLOURS[0], width: 0, paths: () => null, points: { show: true, size: 7, fill: COLOURS[0] } },
      { label: L + '″ measured (mean)', stroke: COLOURS[1], width: 0, paths: () => null, points: { show: true, size: 7, fill: '#fff' } }
    ];
    const bands = [];
    if (s.curve) {
      const c = s.curve;
      series.push({ x: c.frequency_hz, y: d(c.storage_pa) }, { x: c.frequency_hz, y: d(c.storage_low_pa) }, { x: c.frequency_hz, y: d(c.storage_high_pa) },
        { x: c.frequency_hz, y: d(c.loss_pa) }, { x: c.frequency_hz, y: d(c.loss_low_pa) }, { x: c.frequency_hz, y: d(c.loss_high_pa) });
      opts.push({ label: c.model + ' ' + L + '′', stroke: COLOURS[0], width: 2, spanGaps: true, points: { show: false } },
        { label: L + '′ band low', stroke: 'transparent', width: 0, spanGaps: true, points: { show: false } },
        { label: L + '′ band high (95 %)', stroke: 'transparent', width: 0, spanGaps: true, points: { show: false } },
        { label: c.model + ' ' + L + '″', stroke: COLOURS[1], width: 2, dash: [8, 4], spanGaps: true, points: { show: false } },
        { label: L + '″ band low', stroke: 'transparent', width: 0, spanGaps: true, points: { show: false } },
        { label: L + '″ band high (95 %)', stroke: 'transparent', width: 0, spanGaps: true, points: { show: false } });
      bands.push({ series: [5, 4], fill: BANDS[0] }, { series: [8, 7], fill: BANDS[1] });
    }
    const data = merge(series);
    for (const o of opts) o.value = (u, v) => v === null || v === undefined ? '–' : fmt(v) + ' ' + sc.u;
    const pairs = [];
    m.frequency_hz.forEach((f, i) => {
      pairs.push({ x: f, lo: m.storage_low_pa[i] / sc.f, hi: m.storage_high_pa[i] / sc.f });
      pairs.push({ x: f, lo: m.loss_low_pa[i] / sc.f, hi: m.loss_high_pa[i] / sc.f });
    });
    const node = clear($('plot-moduli'));
    const plot = new uPlot({
      title: s.name + (s.curve ? ': ' + s.curve.model + ' (best supported) with its 95 % band' : ': no model converged'),
      width: width(node), height: 380,
      scales: { x: { time: false, distr: 3 }, y: { distr: 3 } },
      axes: [{ label: s.master_curve ? 'reduced frequency a_T f [Hz]' : 'frequency [Hz]', values: logTicks() },
        { label: L + '′, ' + L + '″ [' + sc.u + ']', values: logTicks(), size: 70 }],
      series: [{ label: 'frequency [Hz]', value: (u, v) => v === null ? '–' : fmt(v) + ' Hz' }].concat(opts),
      bands,
      hooks: { draw: [whiskers(pairs)] }
    }, data, node);
    state.plots.push({ key: 'moduli', plot });
    clear($('sample-about')).textContent = (s.best ? 'Best-supported model: ' + s.best + '. ' : '') +
      (s.also_supported && s.also_supported.length ? 'Also supported (ΔAICc < 2): ' + s.also_supported.join(', ') + '. ' : '') +
      (s.closest ? 'Closest reference: ' + s.closest + '. ' : '') + (s.set ? 'Comparable set: ' + s.set + '. ' : '') +
      'Points are replicate means with bars at ± one SD.';
    const rnode = clear($('plot-residuals'));
    if (s.curve) {
      const rdata = [m.frequency_hz, s.curve.residual_storage, s.curve.residual_loss];
      const rplot = new uPlot({
        title: 'Residuals, ln(model/data)', width: width(rnode), height: 200,
        scales: { x: { time: false, distr: 3 } },
        axes: [{ label: 'frequency [Hz]', values: logTicks() }, { label: 'ln(model/data)', size: 70 }],
        series: [{ label: 'frequency [Hz]', value: (u, v) => v === null ? '–' : fmt(v) + ' Hz' },
          { label: L + '′ residual', stroke: COLOURS[0], width: 0, paths: () => null, points: { show: true, size: 7, fill: COLOURS[0] }, value: (u, v) => fmt(v) },
          { label: L + '″ residual', stroke: COLOURS[1], width: 0, paths: () => null, points: { show: true, size: 7, fill: '#fff' }, value: (u, v) => fmt(v) }]
      }, rdata, rnode);
      state.plots.push({ key: 'residuals', plot: rplot });
    }
  }

  function drawRamp(value) {
    destroyPlots(['ramp', 'ramp-tan']);
    if (!value) return;
    const [i, rep] = value.split('|');
    const s = state.result.ramps[Number(i)];
    const ramps = s.ramps.filter(r => r.replicate === rep).sort((a, b) => a.frequency_hz - b.frequency_hz);
    const L = s.letter;
    const sc = modulusUnit(Math.max(...ramps.flatMap(r => r.storage_pa)));
    const series = [];
    const opts = [];
    ramps.forEach((r, k) => {
      series.push({ x: r.temperature_c, y: r.storage_pa.map(v => v / sc.f) }, { x: r.temperature_c, y: r.loss_pa.map(v => v / sc.f) });
      opts.push({ label: L + '′ at ' + fmt(r.frequency_hz) + ' Hz', stroke: COLOURS[k % 7], width: 0, paths: () => null,
        points: { show: true, size: 5, fill: COLOURS[k % 7] }, value: (u, v) => v === null ? '–' : fmt(v) + ' ' + sc.u },
      { label: L + '″ at ' + fmt(r.frequency_hz) + ' Hz', stroke: COLOURS[k % 7], width: 0, paths: () => null,
        points: { show: true, size: 5, fill: '#fff' }, value: (u, v) => v === null ? '–' : fmt(v) + ' ' + sc.u });
    });
    const marks = (u) => {
      const ctx = u.ctx;
      ctx.save();
      ctx.lineWidth = 1.5;
      ramps.forEach((r, k) => {
        [[r.tg_storage_onset_c, [2, 4]], [r.tg_loss_peak_c, [8, 4]], [r.tg_tan_delta_peak_c, [10, 4, 2, 4]]].forEach(([t, dash]) => {
          if (t === null || t === undefined) return;
          const x = u.valToPos(t, 'x', true);
          ctx.strokeStyle = COLOURS[k % 7];
          ctx.setLineDash(dash);
          ctx.beginPath(); ctx.moveTo(x, u.bbox.top); ctx.lineTo(x, u.bbox.top + u.bbox.height); ctx.stroke();
        });
      });
      ctx.restore();
    };
    const node = clear($('plot-ramp'));
    const plot = new uPlot({
      title: s.sample + ', replicate ' + rep + ': Tg lines dotted (E′ onset), dashed (E″ peak), dash-dot (tan δ peak)',
      width: width(node), height: 360,
      scales: { x: { time: false }, y: { distr: 3 } },
      axes: [{ label: 'temperature [°C]' }, { label: L + '′, ' + L + '″ [' + sc.u + ']', values: logTicks(), size: 70 }],
      series: [{ label: 'temperature [°C]', value: (u, v) => v === null ? '–' : fmt(v) + ' °C' }].concat(opts),
      hooks: { draw: [marks] }
    }, merge(series), node);
    state.plots.push({ key: 'ramp', plot });
    const tnode = clear($('plot-ramp-tan'));
    const tplot = new uPlot({
      title: 'tan δ', width: width(tnode), height: 220,
      scales: { x: { time: false } },
      axes: [{ label: 'temperature [°C]' }, { label: 'tan δ [–]', size: 70 }],
      series: [{ label: 'temperature [°C]', value: (u, v) => v === null ? '–' : fmt(v) + ' °C' }].concat(ramps.map((r, k) => ({
        label: 'tan δ at ' + fmt(r.frequency_hz) + ' Hz', stroke: COLOURS[k % 7], width: 0, paths: () => null,
        points: { show: true, size: 5, fill: COLOURS[k % 7] }, value: (u, v) => fmt(v) }))),
      hooks: { draw: [marks] }
    }, merge(ramps.map(r => ({ x: r.temperature_c, y: r.tan_delta }))), tnode);
    state.plots.push({ key: 'ramp-tan', plot: tplot });
  }

  // --- library -------------------------------------------------------------------------------------

  async function loadLibrary() {
    if (!state.about.library) {
      status($('library-status'), 'This server has no reference library. Start it with --library FOLDER to list, add and match references.');
      $('library-add-box').hidden = true;
      return;
    }
    try {
      const r = await api('GET', '/api/library');
      status($('library-status'), 'Library ' + r.library + ': ' + r.entries.length + ' reference(s). The command line and this page share it.');
      const head = el('tr', null, ['name', 'class', 'temperature', 'method', 'basis', 'frequency [Hz]', 'points', ''].map(h => el('th', { scope: 'col', text: h })));
      const rows = r.entries.map(e => el('tr', null, el('td', { text: e.name }), el('td', { text: e.class }), el('td', { text: e.temperature }),
        el('td', { text: e.method }), el('td', { text: e.basis }), el('td', { className: 'n', text: fmt(e.frequency_min_hz) + '–' + fmt(e.frequency_max_hz) }),
        el('td', { className: 'n', text: String(e.points) }),
        el('td', null, el('button', { type: 'button', className: 'secondary', text: 'Show', 'aria-label': 'Show ' + e.name, onclick: () => showReference(e.name) }),
          el('button', { type: 'button', className: 'danger', text: 'Remove', 'aria-label': 'Remove ' + e.name, onclick: () => removeReference(e.name) }))));
      clear($('library-table')).append(el('table', { id: 'table-library' }, el('thead', null, head), el('tbody', null, rows)));
    } catch (e) {
      status($('library-status'), e.message, true);
    }
  }

  async function showReference(name) {
    try {
      const r = await api('GET', '/api/library/' + encodeURIComponent(name));
      $('library-show').hidden = false;
      $('library-show-h').textContent = r.name + ' (' + r['class'] + ')';
      const meta = clear($('library-meta'));
      meta.append(el('table', null, el('tbody', null, Object.entries(r.metadata).map(([k, v]) => el('tr', null, el('th', { scope: 'row', text: k }), el('td', { text: v }))),
        el('tr', null, el('th', { scope: 'row', text: 'file' }), el('td', { text: r.file + ' (SHA-256 ' + r.sha256.slice(0, 12) + '…)' })))));
      destroyPlots(['library']);
      const sc = modulusUnit(Math.max(...r.storage_pa, ...r.loss_pa));
      const node = clear($('plot-library'));
      const plot = new uPlot({
        title: r.name, width: width(node), height: 320,
        scales: { x: { time: false, distr: 3 }, y: { distr: 3 } },
        axes: [{ label: 'frequency [Hz]', values: logTicks() }, { label: r.letter + '′, ' + r.letter + '″ [' + sc.u + ']', values: logTicks(), size: 70 }],
        series: [{ label: 'frequency [Hz]', value: (u, v) => v === null ? '–' : fmt(v) + ' Hz' },
          { label: r.letter + '′', stroke: COLOURS[0], width: 1.5, points: { show: true, size: 6, fill: COLOURS[0] }, value: (u, v) => fmt(v) + ' ' + sc.u },
          { label: r.letter + '″', stroke: COLOURS[1], width: 1.5, dash: [8, 4], points: { show: true, size: 6, fill: '#fff' }, value: (u, v) => fmt(v) + ' ' + sc.u }]
      }, [r.frequency_hz, r.storage_pa.map(v => v / sc.f), r.loss_pa.map(v => v / sc.f)], node);
      state.plots.push({ key: 'library', plot });
    } catch (e) {
      status($('library-status'), e.message, true);
    }
  }

  async function removeReference(name) {
    if (!window.confirm("Remove '" + name + "' from the library? Its file is kept in the library's .removed folder.")) return;
    try {
      const r = await api('DELETE', '/api/library/' + encodeURIComponent(name));
      status($('library-status'), "Removed '" + r.removed + "'; the file is kept as " + r.kept_as + '.');
      $('library-show').hidden = true;
      await loadLibrary();
    } catch (e) {
      status($('library-status'), e.message, true);
    }
  }

  async function addReference(ev) {
    ev.preventDefault();
    const form = new FormData($('library-add'));
    if (!$('lib-replace').checked) form.delete('replace');
    try {
      const r = await api('POST', '/api/library', form, true);
      await loadLibrary();
      status($('library-status'), "Added '" + r.added + "' as " + r.file + (r.warnings.length ? '; warnings: ' + r.warnings.join('; ') : '') + '.');
      $('library-add').reset();
    } catch (e) {
      status($('library-status'), e.message, true);
    }
  }

  // --- start ---------------------------------------------------------------------------------------

  async function start() {
    const drop = $('drop');
    drop.addEventListener('dragover', e => { e.preventDefault(); drop.classList.add('over'); });
    drop.addEventListener('dragleave', () => drop.classList.remove('over'));
    drop.addEventListener('drop', async e => {
      e.preventDefault();
      drop.classList.remove('over');
      upload(await filesFromDrop(e.dataTransfer));
    });
    // dropping anywhere else must not open the file in the browser
    window.addEventListener('dragover', e => e.preventDefault());
    window.addEventListener('drop', e => e.preventDefault());
    $('pick-files').addEventListener('change', e => upload(Array.from(e.target.files).map(f => ({ file: f, path: f.name }))));
    $('pick-folder').addEventListener('change', e => upload(Array.from(e.target.files).map(f => ({ file: f, path: f.webkitRelativePath || f.name }))));
    $('reread').addEventListener('click', inspect);
    $('run').addEventListener('click', run);
    $('sample-pick').addEventListener('change', e => drawSample(state.result.samples[Number(e.target.value)]));
    $('ramp-pick').addEventListener('change', e => drawRamp(e.target.value));
    $('library-add').addEventListener('submit', addReference);
    const tabs = Array.from(document.querySelectorAll('[role=tab]'));
    tabs.forEach((t, i) => {
      t.addEventListener('click', () => selectTab(t.id));
      t.addEventListener('keydown', e => {
        const k = e.key === 'ArrowRight' ? 1 : e.key === 'ArrowLeft' ? -1 : 0;
        if (k) {
          const next = tabs[(i + k + tabs.length) % tabs.length];
          selectTab(next.id);
          next.focus();
        }
      });
    });
    try {
      state.about = await api('GET', '/api/about');
    } catch (e) {
      status($('files-status'), e.message, true);
      return;
    }
    $('version').textContent = 'Version ' + state.about.version + '.';
    $('library-name').textContent = state.about.library ? 'library ' + state.about.library : 'no library on this server';
    $('use-library').disabled = !state.about.library;
    $('use-library').checked = !!state.about.library;
    const models = $('models');
    for (const id of state.about.models) {
      models.append(el('label', null, el('input', { type: 'checkbox', value: id, checked: true }), ' ' + id));
    }
    if (state.about.data) {
      $('data-browser').hidden = false;
      $('data-up').addEventListener('click', () => browseData(state.dataPath.split('/').slice(0, -1).join('/')));
      $('data-use').addEventListener('click', () => { state.source = { data: state.dataPath || '.' }; inspect(); });
      browseData('');
    }
    loadLibrary();
  }

  document.addEventListener('DOMContentLoaded', start);
}());
