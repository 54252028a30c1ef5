#!/usr/bin/python3
"""Differential test of `kiln estimate --json` against RDKit (Debian python3-rdkit).

Run by hand, not by CI. See README.md in this directory; --help lists the
modes and options.
"""
import argparse, json, math, os, random, subprocess, sys, time, re, collections
from concurrent.futures import ThreadPoolExecutor
from rdkit import Chem, RDLogger
from rdkit.Chem import Descriptors, rdMolDescriptors

RDLogger.DisableLog('rdApp.*')
# The kiln binary: --kiln, else the KILN environment variable, else this.
KILN = os.environ.get('KILN', '/tmp/kiln-tester')
# The repository the in-process helper is built against (random mode's REPO
# argument overrides it): the one this script is in.
REPO = os.path.normpath(os.path.join(os.path.dirname(os.path.abspath(__file__)), '..', '..'))
SLOW_MS = 100.0

def run_kiln(smiles, extra=()):
    t0 = time.perf_counter()
    try:
        p = subprocess.run([KILN, 'estimate', *smiles, '--json', *extra], capture_output=True,
                           text=True, timeout=30)
    except subprocess.TimeoutExpired:
        return None, 30000.0, 'timeout'
    ms = (time.perf_counter() - t0) * 1000
    try:
        return json.loads(p.stdout), ms, p.returncode
    except Exception:
        return None, ms, 'badjson rc=%s stderr=%s' % (p.returncode, p.stderr[:200])


# In-process helper: times parse + estimate of each SMILES with a fresh
# workspace (no cache shared between spellings) and prints kiln's canonical
# SMILES, so RDKit can check that the canonical form is the same molecule.
HELPER_GO = r'''package main

import (
	"bufio"
	"encoding/json"
	"os"
	"time"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/engine/molecule"
)

type out struct {
	Smi, Canon, ParseErr, EstErr string
	Ms                           float64
	Hf, S                        float64
}

func main() {
	sc := bufio.NewScanner(os.Stdin)
	sc.Buffer(make([]byte, 1<<20), 1<<20)
	enc := json.NewEncoder(os.Stdout)
	for sc.Scan() {
		s := sc.Text()
		o := out{Smi: s}
		ws := analysis.NewWorkspace(".", os.ReadFile, analysis.DefaultSettings())
		t0 := time.Now()
		m, err := molecule.ParseSMILES(s)
		if err != nil {
			o.ParseErr = err.Error()
		} else {
			e, err := ws.EstimateMolecule(m, analysis.EstimateOptions{})
			o.Ms = float64(time.Since(t0).Microseconds()) / 1000
			o.Canon = m.CanonicalStereo()
			if err != nil {
				o.EstErr = err.Error()
			} else {
				o.Hf, o.S = e.Hf298, e.S298
			}
		}
		enc.Encode(o)
	}
}
'''

def build_helper(repo):
    import tempfile, os, shutil
    d = tempfile.mkdtemp(prefix='kiln-difftest-')
    open(os.path.join(d, 'main.go'), 'w').write(HELPER_GO)
    gover = re.search(r'^go (\S+)', open(os.path.join(repo, 'go.mod')).read(), re.M).group(1)
    open(os.path.join(d, 'go.mod'), 'w').write('module ktime\n\ngo %s\n\nrequire kiln.dev/kiln v0.0.0\nreplace kiln.dev/kiln => %s\n' % (gover, repo))
    shutil.copy(os.path.join(repo, 'go.sum'), d)
    subprocess.run(['go', 'build', '-mod=mod', '-o', os.path.join(d, 'ktime'), '.'], cwd=d, check=True)
    return os.path.join(d, 'ktime')

def run_helper(exe, smiles, timeout=300):
    """Returns {smiles: record}; on a hang, falls back to one process per SMILES."""
    try:
        p = subprocess.run([exe], input='\n'.join(smiles) + '\n', capture_output=True, text=True, timeout=timeout)
        recs = [json.loads(l) for l in p.stdout.splitlines()]
        if len(recs) == len(smiles):
            return {r['Smi']: r for r in recs}
    except subprocess.TimeoutExpired:
        pass
    out = {}
    for s in smiles:
        try:
            p = subprocess.run([exe], input=s + '\n', capture_output=True, text=True, timeout=20)
            out[s] = json.loads(p.stdout) if p.stdout.strip() else {'Smi': s, 'Crash': p.stderr[-300:]}
        except subprocess.TimeoutExpired:
            out[s] = {'Smi': s, 'Timeout': True, 'Ms': 20000}
    return out

# ---------------------------------------------------------------- generation
VAL = {'C': 4, 'N': 3, 'O': 2, 'S': 2, 'F': 1, 'Cl': 1, 'Br': 1, 'P': 3, 'Si': 4, 'B': 3, 'I': 1, 'Se': 2}
SCAFFOLDS = ['c1ccccc1', 'c1ccc2ccccc2c1', 'c1ccncc1', 'c1ccoc1', 'c1ccsc1', 'c1cc[nH]c1', 'C1=CCC=C1',
             'C12C3C4C1C5C2C3C45', 'C1C2CC3CC1CC(C2)C3', 'C1CC2CCC1C2', 'C1CC2CCC1CC2', 'C1C2C1C2',
             'C1CC11CC1', 'C1CC1', 'C1CCC1', 'C1CCCC1', 'C1CCCCC1', 'C1CCCCCC1', 'C1CCCCCCC1', 'C1=CC1',
             'C1=CCC1', 'C=C1CC1', 'C1OC1', 'C1CCOC1', 'C1COCCO1', 'C1CC2CC2C1', 'C12C3C1C23',
             'C1CC2C1C2', 'C1CC2CC1C=C2', 'C1CC2(C1)CC2', 'c1ccc2c(c1)CC2', 'O=C1CCCC1', 'C1=CC=CC=CC=C1',
             'C1CC2CCC3CCC1C23', 'C1C2CC3C1C3C2', 'C(C)(C)(C)C', 'CC(C)C', 'C=C=C', 'C#CC#C', 'O=C=C',
             'OO', 'COOC', 'C1CC2CCCC2C1', 'C12CC3CC(C1)C23']
SUBST = ['C', 'CC', 'O', 'OC', 'C=O', 'C(=O)O', '[CH2]', '[O]', 'OO', 'O[O]', 'C=C', 'C#C', '[CH]C',
         'F', 'Cl', 'Br', 'N', 'C#N', 'S', 'N(=O)=O', 'c1ccccc1', 'C(C)(C)C', '[C](C)C', 'C(F)(F)F']

def rand_graph(rng, hetero):
    elems = ['C'] * 12 + ['O'] * 3
    if hetero:
        elems += ['N'] * 3 + ['S', 'F', 'Cl', 'Br'] + (['P', 'Si', 'B', 'I', 'Se'] if rng.random() < 0.1 else [])
    n = rng.choice([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 12, 14, 18])
    rw = Chem.RWMol()
    free = []
    for i in range(n):
        e = rng.choice(elems) if i else rng.choice(['C', 'C', 'O'] if not hetero else elems)
        cands = [j for j in range(i) if free[j] > 0]
        if i and not cands:
            break
        idx = rw.AddAtom(Chem.Atom(e)); free.append(VAL[e])
        if i:
            j = rng.choice(cands)
            mx = min(free[j], free[i], 3)
            o = rng.choices([1, 2, 3], weights=[80, 15, 5])[0]
            o = min(o, mx)
            rw.AddBond(j, i, {1: Chem.BondType.SINGLE, 2: Chem.BondType.DOUBLE, 3: Chem.BondType.TRIPLE}[o])
            free[j] -= o; free[i] -= o
    for _ in range(rng.choice([0, 0, 1, 1, 2, 3, 4])):
        c = [a for a in range(rw.GetNumAtoms()) if free[a] > 0]
        if len(c) < 2: break
        a, b = rng.sample(c, 2)
        if rw.GetBondBetweenAtoms(a, b): continue
        o = 2 if (rng.random() < 0.1 and free[a] >= 2 and free[b] >= 2) else 1
        rw.AddBond(a, b, Chem.BondType.DOUBLE if o == 2 else Chem.BondType.SINGLE)
        free[a] -= o; free[b] -= o
    return rw, free

def add_radicals_charges(rng, rw, free, rad_p=0.2, chg_p=0.03):
    if rng.random() < rad_p:
        for _ in range(rng.choice([1, 1, 1, 2])):
            c = [a for a in range(rw.GetNumAtoms()) if free[a] > 0 and rw.GetAtomWithIdx(a).GetSymbol() in ('C', 'O', 'N', 'S')]
            if not c: break
            a = rng.choice(c); at = rw.GetAtomWithIdx(a)
            at.SetNumRadicalElectrons(at.GetNumRadicalElectrons() + 1)
            free[a] -= 1
    if rng.random() < chg_p:
        a = rng.randrange(rw.GetNumAtoms()); at = rw.GetAtomWithIdx(a)
        at.SetFormalCharge(rng.choice([-1, 1]))
    return rw

def explicit_radicals(rw, free):
    # radical atoms: fix H count so RDKit does not fill the valence
    for at in rw.GetAtoms():
        if at.GetNumRadicalElectrons():
            at.SetNoImplicit(True); at.SetNumExplicitHs(max(free[at.GetIdx()], 0))

def rand_mol(rng):
    kind = rng.random()
    try:
        if kind < 0.35:  # scaffold + substituents
            m = Chem.MolFromSmiles(rng.choice(SCAFFOLDS))
            hetero = rng.random() < 0.3
            for _ in range(rng.choice([0, 1, 1, 2, 3])):
                subs = SUBST if hetero else [s for s in SUBST if not re.search(r'[NSFBl]', s)]
                s = Chem.MolFromSmiles(rng.choice(subs))
                hs = [a.GetIdx() for a in m.GetAtoms() if a.GetTotalNumHs() > 0]
                ss = [a.GetIdx() for a in s.GetAtoms() if a.GetTotalNumHs() > 0 or a.GetNumRadicalElectrons()]
                if not hs or not ss: break
                combo = Chem.RWMol(Chem.CombineMols(m, s))
                a, b = rng.choice(hs), rng.choice(ss) + m.GetNumAtoms()
                combo.AddBond(a, b, Chem.BondType.SINGLE)
                for x in (a, b):
                    at = combo.GetAtomWithIdx(x)
                    if at.GetNumRadicalElectrons():
                        at.SetNumRadicalElectrons(at.GetNumRadicalElectrons() - 1)
                    elif at.GetNumExplicitHs():
                        at.SetNumExplicitHs(at.GetNumExplicitHs() - 1)
                m = combo.GetMol(); Chem.SanitizeMol(m)
            if rng.random() < 0.15:  # make a radical by removing an H
                rw = Chem.RWMol(m)
                hs = [a for a in rw.GetAtoms() if a.GetTotalNumHs() > 0 and not a.GetIsAromatic()]
                if hs:
                    at = rng.choice(hs); h = at.GetTotalNumHs()
                    at.SetNoImplicit(True); at.SetNumExplicitHs(h - 1)
                    at.SetNumRadicalElectrons(at.GetNumRadicalElectrons() + 1)
                m = rw.GetMol()
        else:
            hetero = kind > 0.75
            rw, free = rand_graph(rng, hetero)
            add_radicals_charges(rng, rw, free)
            explicit_radicals(rw, free)
            if rng.random() < 0.05:  # disconnected
                rw2, free2 = rand_graph(rng, False)
                rw = Chem.RWMol(Chem.CombineMols(rw, rw2))
            m = rw.GetMol()
        Chem.SanitizeMol(m)
        smi = Chem.MolToSmiles(m)
        m2 = Chem.MolFromSmiles(smi)
        if m2 is None or Chem.MolToSmiles(m2) != smi:
            return None
        return m2
    except Exception:
        return None

# ---------------------------------------------------------------- comparison
def elem_counts(formula):
    out = collections.Counter()
    for e, n in re.findall(r'([A-Z][a-z]?)(\d*)', formula or ''):
        out[e] += int(n) if n else 1
    return out

def rd_counts(m):
    c = collections.Counter()
    for a in m.GetAtoms():
        c[a.GetSymbol()] += 1
        c['H'] += a.GetTotalNumHs()
    return +c

def centre_elem(g):
    c = g.split('-', 1)[0]
    for p, e in (('Cl', 'Cl'), ('Br', 'Br'), ('CO', 'CO'), ('C', 'C'), ('O', 'O'), ('N', 'N'), ('S', 'S'), ('F', 'F'), ('I', 'I')):
        if c.startswith(p):
            return e
    return '?' + c

def key(r):
    if r.get('error'):
        return ('error',)
    cp = r.get('cp_j_mol_k') or {}
    return (round(r['hf298_kj_mol'], 6), round(r['s298_j_mol_k'], 6),
            tuple((k, round(v, 6)) for k, v in sorted(cp.items())), r['symmetry_number'], r['optical_isomers'])

def check_one(m, res):
    """Problems with one kiln result for RDKit molecule m (list of (category, detail))."""
    probs = []
    rdc = rd_counts(m)
    heavy = collections.Counter(a.GetSymbol() for a in m.GetAtoms())
    chg = Chem.GetFormalCharge(m)
    nrad = Descriptors.NumRadicalElectrons(m)
    kc = elem_counts(res.get('formula'))
    if res.get('formula') is not None and kc != rdc:
        probs.append(('formula', '%s vs rdkit %s' % (res['formula'], rdMolDescriptors.CalcMolFormula(m))))
    if res.get('molar_mass_g_mol') is not None and abs(res['molar_mass_g_mol'] - Descriptors.MolWt(m) - chg * 0.000549) > 0.02:
        probs.append(('mass', '%.3f vs rdkit %.3f' % (res['molar_mass_g_mol'], Descriptors.MolWt(m))))
    if res.get('error'):
        return probs
    hf, s, cp, u, sig = res['hf298_kj_mol'], res['s298_j_mol_k'], res['cp_j_mol_k'], res['uncertainty_hf298_kj_mol'], res['symmetry_number']
    lib = len(res['groups']) == 1 and res['groups'][0]['name'].startswith('reference:')
    # A reference-library species has no uncertainty of kiln's (null): the
    # tabulated source's own applies.
    for name, v in (('hf', hf), ('s', s)) + ((('u', u),) if not lib else ()):
        if v is None or not math.isfinite(v):
            probs.append(('nonfinite', '%s=%r' % (name, v)))
    if s is not None and s <= 0: probs.append(('S<=0', s))
    if not cp or any((v is None or not math.isfinite(v) or v <= 0) for v in cp.values()):
        probs.append(('Cp<=0', cp))
    else:
        vals = [cp[k] for k in sorted(cp, key=float)]
        if any(b < a - 1e-9 for a, b in zip(vals, vals[1:])):
            probs.append(('Cp-nonmonotonic', vals))
    if not lib and u is not None and u <= 0: probs.append(('unc<=0', u))
    if not lib and (sig is None or sig < 1): probs.append(('sigma<1', sig))
    if chg != 0 or any(a.GetFormalCharge() for a in m.GetAtoms()):
        probs.append(('charged-accepted', 'net %d' % chg))
    groups = res.get('groups') or []
    cen = collections.Counter()
    for g in groups:
        # A carbonyl group CO-… and a ketene carbon Ck (C=C=O) each count
        # their C and their O.
        for e in (['C', 'O'] if centre_elem(g['name']) == 'CO' or g['name'].startswith('Ck') else [centre_elem(g['name'])]):
            cen[e] += g['count']
    # Halogens are ligands in Benson groups (C-(Cl)(C)(H)2): no group is
    # centred on them.
    heavy = collections.Counter({k: v for k, v in heavy.items() if k not in ('F', 'Cl', 'Br', 'I')})
    lib = len(groups) == 1 and groups[0]['name'].startswith('reference:')
    if not lib and +cen != +heavy:
        probs.append(('atom-accounting', 'centres %s vs heavy %s' % (dict(cen), dict(heavy))))
    hbi = sum(c['count'] for c in res.get('corrections') or [] if c['name'].startswith('HBI'))
    if not lib and hbi != nrad:
        probs.append(('radical-count', 'HBI terms %d vs rdkit radical electrons %d' % (hbi, nrad)))
    if not lib and nrad == 0 and any('spin' in c['name'] for c in res.get('corrections') or []):
        probs.append(('radical-count', 'spin term on closed shell'))
    if res.get('missing_groups') == [] and u is not None and u > 40:
        pass
    return probs

def aromatic_atoms(smiles):
    """Number of aromatic (lower-case) atoms in a SMILES: bare c, n, o, s and
    bracket atoms whose element is lower case ([nH], [c]); Cl is not c."""
    return sum(1 for t in re.findall(r'\[[^\]]*\]|Cl|Br|[A-Za-z]', smiles)
               if (t[0] == '[' and len(t) > 1 and t[1] in 'cnos' and t[1:3] != 'cl') or t in ('c', 'n', 'o', 's'))

def mode_random(n, seed=1, repo=REPO, aromatic=False):
    rng = random.Random(seed)
    mols, seen = [], set()
    while len(mols) < n:
        m = rand_mol(rng)
        if m is None: continue
        s = Chem.MolToSmiles(m)
        if s in seen: continue
        seen.add(s); mols.append(s)
    stats = collections.Counter(); bad = collections.defaultdict(list); refusals = collections.Counter()
    # 1. CLI, canonical RDKit SMILES in batches; each batch also in reverse order (order dependence)
    chunks = [mols[i:i + 100] for i in range(0, len(mols), 100)]
    def cli(ch):
        a, _, rca = run_kiln(ch)
        b, _, _ = run_kiln(ch[::-1])
        if a is None or len(a) != len(ch):  # fall back to one call each
            a = [(run_kiln([x])[0] or [{'error': {'message': 'kiln crash/timeout', 'position': None}, 'crash': True}])[0] for x in ch]
            b = None
        return ch, a, (b[::-1] if b else None)
    res = {}
    with ThreadPoolExecutor(2) as ex:
        for ch, a, b in ex.map(cli, chunks):
            for i, x in enumerate(ch):
                res[x] = a[i]
                if b is not None and key(a[i]) != key(b[i]):
                    bad['order-dependence'].append((x, key(a[i])[:2], key(b[i])[:2]))
    # 2. in-process helper: 5 random spellings each, fresh workspace each
    exe = build_helper(repo)
    spell = {}
    allsp = []
    for x in mols:
        m = Chem.MolFromSmiles(x); sp = [x]
        for k in range(60):
            r = Chem.MolToSmiles(m, doRandom=True, canonical=False)
            if r not in sp: sp.append(r)
            if len(sp) == 6: break
        spell[x] = sp; allsp += sp
    hres = {}
    hchunks = [allsp[i:i + 600] for i in range(0, len(allsp), 600)]
    with ThreadPoolExecutor(2) as ex:
        for d in ex.map(lambda c: run_helper(exe, c), hchunks):
            hres.update(d)
    slow = []
    for x in mols:
        stats['tested'] += 1
        m = Chem.MolFromSmiles(x)
        r = res[x]
        if r.get('crash'):
            bad['crash/timeout'].append(x); continue
        if r.get('error'):
            stats['refused'] += 1
            msg = re.sub(r'\d+', '#', r['error']['message'])[:90]
            refusals[msg] += 1
            cho = set(a.GetSymbol() for a in m.GetAtoms()) <= {'C', 'O'} and not any(a.GetFormalCharge() for a in m.GetAtoms())
            if cho: bad['refused-CHO (info)'].append((x, r['error']['message'][:160]))
            if r['error'].get('position') is not None:
                bad['rdkit-accepts-kiln-parse-error'].append((x, r['error']['message'][:160]))
        else:
            stats['estimated'] += 1
        ps = check_one(m, r)
        for cat, d in ps: bad[cat].append((x, d))
        if not ps: stats['agree-single'] += 1
        hs = [hres.get(sp, {'Smi': sp, 'Missing': True}) for sp in spell[x]]
        for h in hs:
            if h.get('Timeout') or h.get('Crash') or h.get('Missing'):
                bad['helper-crash/timeout'].append((h['Smi'], h.get('Crash', '')))
            elif h.get('Ms', 0) > SLOW_MS:
                slow.append((h['Ms'], h['Smi']))
        ok = [h for h in hs if 'Hf' in h]
        outs = set((h['ParseErr'] != '', h['EstErr'] != '', round(h['Hf'], 3), round(h['S'], 6)) for h in ok)
        if len(outs) > 1:
            bad['spelling-variance'].append((x, [(h['Smi'], h['EstErr'][:60] or (round(h['Hf'] / 4184, 2), round(h['S'] / 4.184, 2))) for h in ok]))
        else:
            stats['spelling-invariant'] += 1
        # kiln's canonical form must be the same molecule as the input
        cs = set(h['Canon'] for h in ok if h['Canon'])
        if len(cs) > 1: stats['kiln-canonical-not-unique'] += 1; bad['kiln-canonical-not-unique'].append((x, sorted(cs)))
        for c in cs:
            cm = Chem.MolFromSmiles(c)
            if cm is None or Chem.MolToSmiles(cm) != x:
                bad['kiln-canonical-is-other-molecule'].append((x, c, cm and Chem.MolToSmiles(cm)))
            if aromatic:
                # aromaticity: lower-case atoms of kiln's canonical form vs RDKit's aromatic atoms
                ka, ra = aromatic_atoms(c), sum(1 for a in m.GetAtoms() if a.GetIsAromatic())
                if ka != ra:
                    bad['aromatic-atom-count'].append((x, c, ka, ra))
    return stats, bad, refusals, slow

def mode_fuzz(n, seed=2):
    rng = random.Random(seed)
    base = []
    while len(base) < 300:
        m = rand_mol(rng)
        if m is not None: base.append(Chem.MolToSmiles(m, doRandom=True, canonical=False))
    base += ['C[C@TH1](F)(Cl)Br', 'C[C@@TH2](O)CC', 'C[C@OH1](F)', 'CoC', 'C(C.)C', 'CClC', 'C$C', 'c1ccccc1',
             'C%10CC%10', 'C1CC1%11', '[13CH4]', '[2H]C', 'C[H]', '[CH5]', 'C==C', 'C1CC', '[C@H](F)(Cl)Br',
             'C.C', '.C', 'C..C', '[Fe]', '[Li][Li]', '[nH]1cccc1', 'c1cc[nH]c1', 'n1ccccc1', 'C(', ')C', 'C((C))C',
             'C=1CC1', 'C1CC=1', 'C-1CC1', 'C1CC-1', 'C=1CC#1', '[C+]', '[CH3+]', '[OH-]', '[O-2]', '[C++]',
             'C\\C=C/C', 'C/C=C/C', 'C/C(/C)=C', 'c1cccc1', 'c1ccccc', 'C1.C1', 'C12CC12', '*C', '[*]C', 'C[C@@]',
             '[CH4:1]', '[C:0]', 'Cc1ccccc1', 'ccc', 'o1cccc1', 'O=c1cccc[nH]1', 'B', 'P', 'I', '[Si]', 'CB', 'Cl', 'Br']
    muts = list('()[]=#%0123456789.@+-/\\cCoOnNHs:$*')
    cases = list(base[300:])
    while len(cases) < n:
        s = list(rng.choice(base[:300]))
        for _ in range(rng.choice([1, 1, 2, 3])):
            op = rng.random(); p = rng.randrange(len(s) + 1)
            if op < 0.4: s.insert(p, rng.choice(muts))
            elif op < 0.7 and s: s.pop(min(p, len(s) - 1))
            elif s: s[min(p, len(s) - 1)] = rng.choice(muts)
        cases.append(''.join(s))
    out = collections.Counter(); dis = collections.defaultdict(list)
    def one(s):
        res, ms, rc = run_kiln([s])
        return s, res, ms, rc
    with ThreadPoolExecutor(2) as ex:
        for s, res, ms, rc in ex.map(one, cases):
            rd = Chem.MolFromSmiles(s)
            rdparse = Chem.MolFromSmiles(s, sanitize=False) is not None
            if res is None:
                dis['kiln-crash'].append((s, rc)); continue
            r = res[0]
            kparse = not (r.get('error') and r['error'].get('position') is not None)
            kval = not r.get('error')
            cls = ('rd-ok' if rd is not None else ('rd-sanitize-fail' if rdparse else 'rd-parse-fail'),
                   'kiln-value' if kval else ('kiln-refused' if kparse else 'kiln-parse-error'))
            out[cls] += 1
            if cls[0] != 'rd-ok' and cls[1] != 'kiln-parse-error':
                dis[cls].append((s, r.get('formula'), (r.get('error') or {}).get('message', '')[:120]))
            if cls[0] == 'rd-ok' and cls[1] == 'kiln-parse-error':
                dis[cls].append((s, r['error']['message'][:120]))
            if cls[0] == 'rd-ok' and r.get('formula'):
                if elem_counts(r['formula']) != rd_counts(rd):
                    dis['formula-diff'].append((s, r['formula'], rdMolDescriptors.CalcMolFormula(rd)))
    return out, dis

def mode_order(seed=3):
    rng = random.Random(seed)
    mols = []
    while len(mols) < 60:
        m = rand_mol(rng)
        if m is not None and set(a.GetSymbol() for a in m.GetAtoms()) <= {'C', 'O'}:
            mols.append(m)
    sp = []
    for m in mols:
        for _ in range(3): sp.append(Chem.MolToSmiles(m, doRandom=True, canonical=False))
    single = {s: key(run_kiln([s])[0][0]) for s in sp}
    bad = []
    for trial in range(3):
        o = sp[:]; rng.shuffle(o)
        res = run_kiln(o)[0]
        for s, r in zip(o, res):
            if key(r) != single[s]: bad.append((trial, s, key(r)[:2], single[s][:2]))
    return len(sp), bad

# ---------------------------------------------------------------- reference spot checks
# Total symmetry numbers (external proper rotations x internal rotor tops), the
# convention kiln prints (ethane 18). Point groups are textbook facts (common
# practice); "graph" marks rings where kiln documents the flat-graph sigma.
SIGMA = [('C', 12), ('CC', 18), ('CCC', 18), ('CC(C)C', 81), ('CC(C)(C)C', 972), ('CC(C)(C)C(C)(C)C', 13122),
         ('c1ccccc1', 12), ('C1C2CC3CC1CC(C2)C3', 12), ('C12C3C4C1C5C2C3C45', 24), ('C1CC2CCC1CC2', 6),
         ('C1CC2CCC1C2', 2), ('C1CC11CC1', 4), ('C1C2C1C2', 2), ('C12C3C1C23', 12), ('C12C3C4C1C4C23', 6),
         ('c1ccc2ccccc2c1', 4), ('C=C', 4), ('C#C', 2), ('C=C=C', 4), ('CC#C', 3), ('CC#CC', 18), ('O=C=O', 2),
         ('C1CC1', 6), ('CO', 3), ('COC', 18), ('CC(C)=O', 18), ('CC=O', 3), ('Cc1ccccc1', 6), ('O=C1C=CC(=O)C=C1', 4),
         ('C1OC1', 2), ('c1ccoc1', 2), ('C1=CC1', 2), ('CC(C)(C)O', 81), ('OC(C)(C)C(C)(C)O', 162),
         ('C12(C)CC3(C)CC(C)(C1)CC(C)(C3)C2', 972), ('C[CH2]', 6), ('C[CH]C', 18), ('[CH2]C=C', 2),
         ('[CH2]c1ccccc1', 2), ('CC(C)(C)OOC(C)(C)C', 2 * 81 * 81 * 1), ('C1CCCCC1', 6), ('C1CCC1', 8), ('C1CCCC1', 10),
         ('ClC(Cl)(Cl)Cl', 12), ('CCl', 3), ('N', 3), ('FS(F)(F)(F)(F)F', 24), ('FC(F)(F)F', 12), ('C(F)(F)(F)C(F)(F)F', 18)]

def mode_sigma():
    rows = []
    for smi, exp in SIGMA:
        m = Chem.MolFromSmiles(smi)
        got = set()
        for k in range(5):
            sp = smi if k == 0 else Chem.MolToSmiles(m, doRandom=True, canonical=False)
            r = run_kiln([sp])[0]
            r = r[0] if r else {'error': {'message': 'crash'}}
            got.add(r['symmetry_number'] if not r.get('error') else 'refused: ' + r['error']['message'][:60])
        rows.append((smi, exp, sorted(got, key=str), 'OK' if got == {exp} else 'DIFF'))
    return rows


# Gas-phase ΔHf°298 (kcal/mol) and S°298 (cal/(mol K), None if not recalled),
# all from memory of handbook values (NIST WebBook / Pedley / Cohen-Benson era
# compilations); treat as approximate (±1 kcal/mol, ±1 cal/(mol K)).
EXP = [
 ('CC', 'ethane', -20.0, 54.8), ('CCC', 'propane', -25.0, 64.5), ('CCCC', 'n-butane', -30.0, 74.1),
 ('CC(C)C', 'isobutane', -32.1, 70.4), ('CC(C)(C)C', 'neopentane', -40.1, 73.2), ('CCCCCC', 'n-hexane', -39.9, 92.8),
 ('CC(C)(C)C(C)(C)C', '2,2,3,3-tetramethylbutane', -53.9, None),
 ('C1CC1', 'cyclopropane', 12.7, 56.8), ('C1CCC1', 'cyclobutane', 6.8, 63.4), ('C1CCCC1', 'cyclopentane', -18.3, 70.0),
 ('C1CCCCC1', 'cyclohexane', -29.5, 71.3), ('C1CCCCCC1', 'cycloheptane', -28.2, 81.8),
 ('C=C', 'ethylene', 12.5, 52.4), ('CC=C', 'propene', 4.9, 63.8), ('CCC=C', '1-butene', 0.0, 73.6),
 ('CC(C)=C', 'isobutene', -4.0, 70.2), ('C=CC=C', '1,3-butadiene', 26.0, 66.6), ('C=C=C', 'allene', 45.5, 58.3),
 ('CC#C', 'propyne', 44.3, 59.3), ('C#C', 'acetylene', 54.2, 48.0), ('C#CC#C', 'diacetylene', 111.0, None),
 ('c1ccccc1', 'benzene', 19.8, 64.4), ('Cc1ccccc1', 'toluene', 12.0, 76.6), ('c1ccc2ccccc2c1', 'naphthalene', 36.0, 80.2),
 ('C=Cc1ccccc1', 'styrene', 35.1, 82.5), ('C1=CCCCC1', 'cyclohexene', -1.1, 74.3), ('C1=CCCC1', 'cyclopentene', 8.1, 69.2),
 ('C1=CCC=C1', 'cyclopentadiene', 32.1, 65.5), ('C1=CC1', 'cyclopropene', 66.2, 58.4), ('C1=CCC1', 'cyclobutene', 37.5, 63.0),
 ('C=C1CC1', 'methylenecyclopropane', 48.0, None), ('C1C2CC12', 'bicyclo[1.1.0]butane', 51.9, None),
 ('C1CC11CC1', 'spiropentane', 44.3, 67.5), ('C1CC2CC12', 'bicyclo[2.1.0]pentane', 37.3, None),
 ('C1CC2CCC1C2', 'norbornane', -12.4, None), ('C1CC2C=CC1C2', 'norbornene', 21.3, None),
 ('C1CC2CCC1CC2', 'bicyclo[2.2.2]octane', -23.7, None), ('C1C2CC3CC1CC(C2)C3', 'adamantane', -31.8, None),
 ('C12C3C4C1C5C2C3C45', 'cubane', 148.7, None), ('C1CCC2CCCCC2C1', 'decalin (cis/trans avg)', -45.0, None),
 ('CO', 'methanol', -48.0, 57.3), ('CCO', 'ethanol', -56.2, 67.5), ('COC', 'dimethyl ether', -44.0, 63.7),
 ('CCOCC', 'diethyl ether', -60.3, 81.9), ('CC=O', 'acetaldehyde', -39.7, 63.2), ('CCC=O', 'propanal', -45.5, 72.8),
 ('CC(C)=O', 'acetone', -52.2, 70.5), ('OC=O', 'formic acid', -90.5, 59.4), ('CC(=O)O', 'acetic acid', -103.4, 67.6),
 ('COC(C)=O', 'methyl acetate', -98.0, None), ('COC=O', 'methyl formate', -85.0, 68.0), ('C1CO1', 'oxirane', -12.6, 58.1),
 ('C1CCOC1', 'tetrahydrofuran', -44.0, 72.0), ('C1COCCO1', '1,4-dioxane', -75.5, 71.6), ('c1ccoc1', 'furan', -8.3, 63.9),
 ('Oc1ccccc1', 'phenol', -23.0, 75.4), ('COOC', 'dimethyl peroxide', -30.0, None), ('CCOO', 'ethyl hydroperoxide', -39.5, None),
 ('O=C1CCCC1', 'cyclopentanone', -46.0, 71.2), ('O=C1CCCCC1', 'cyclohexanone', -54.0, 80.0), ('CC(C)(C)O', 'tert-butanol', -74.7, 77.9),
 ('C=CO', 'vinyl alcohol (syn)', -29.8, None), ('C=CC=O', 'acrolein', -18.0, 67.4), ('O=CC=O', 'glyoxal', -50.7, 65.0),
 ('CC(=O)C(C)=O', 'biacetyl', -78.2, None), ('CC(=O)OC(C)=O', 'acetic anhydride', -136.8, None),
 # radicals
 ('C[CH2]', 'ethyl', 28.9, 59.0), ('C[CH]C', 'isopropyl', 21.5, 69.0), ('C[C](C)C', 'tert-butyl', 12.3, 75.0),
 ('C=C[CH2]', 'allyl', 40.9, 62.1), ('[CH2]c1ccccc1', 'benzyl', 49.5, 75.7), ('C=[CH]', 'vinyl', 71.5, 56.3),
 ('[c]1ccccc1', 'phenyl', 81.0, 69.4), ('C#C[CH2]', 'propargyl', 84.0, 60.5), ('C[O]', 'methoxy', 5.0, 55.0),
 ('CC[O]', 'ethoxy', -3.3, 66.0), ('[CH2]O', 'hydroxymethyl', -4.0, 58.4), ('C[C]=O', 'acetyl', -2.5, 63.9),
 ('CO[O]', 'methylperoxy', 2.5, 64.3), ('[O]c1ccccc1', 'phenoxy', 13.0, 73.1), ('[CH2]C=O', 'vinoxy', 3.5, 61.4),
 ('CC(C)(C)O[O]', 'tert-butylperoxy', -24.7, None), ('[CH2]CCC', '1-butyl', 19.0, None), ('C1[CH]C1', 'cyclopropyl', 66.9, None),
 ('C1C[CH]C1', 'cyclobutyl', 51.0, None), ('C1CC[CH]C1', 'cyclopentyl', 25.5, None), ('C1CC[CH]CC1', 'cyclohexyl', 13.0, None),
 ('[CH]1C=CC=C1', 'cyclopentadienyl', 63.0, None), ('C=C[C]=O', 'acryloyl (placeholder)', None, None),
 # N, S, halogen (kiln refuses today; listed to check refusal instead of a wrong number)
 ('CCl', 'chloromethane', -19.6, 56.0), ('ClCCl', 'dichloromethane', -22.8, 64.6), ('ClC(Cl)Cl', 'chloroform', -24.6, 70.7),
 ('ClC(Cl)(Cl)Cl', 'CCl4', -22.9, 74.0), ('CF', 'fluoromethane', -56.0, 53.3), ('FC(F)(F)F', 'CF4', -223.0, 62.5),
 ('CBr', 'bromomethane', -8.5, 59.1), ('CCCl', 'chloroethane', -26.8, 65.9), ('Clc1ccccc1', 'chlorobenzene', 12.4, 74.9),
 ('Fc1ccccc1', 'fluorobenzene', -27.7, 72.3), ('CN', 'methylamine', -5.5, 58.0), ('CNC', 'dimethylamine', -4.4, 65.2),
 ('CN(C)C', 'trimethylamine', -5.7, 69.0), ('CC#N', 'acetonitrile', 17.7, 58.2), ('c1ccncc1', 'pyridine', 33.6, 67.6),
 ('c1cc[nH]c1', 'pyrrole', 25.9, 64.8), ('Nc1ccccc1', 'aniline', 20.8, 76.3), ('C[N+](=O)[O-]', 'nitromethane', -17.8, 65.7),
 ('CS', 'methanethiol', -5.5, 60.9), ('CSC', 'dimethyl sulfide', -8.9, 68.3), ('CCS', 'ethanethiol', -11.1, 70.8),
 ('c1ccsc1', 'thiophene', 27.5, 66.7), ('CS(C)=O', 'dimethyl sulfoxide', -36.1, 73.2), ('CSSC', 'dimethyl disulfide', -5.8, 80.5),
 ('S=C=S', 'carbon disulfide', 27.9, 56.8), ('C[S]', 'methylthiyl', 29.8, None), ('[CH2]Cl', 'chloromethyl', 28.0, None),
 ('C[NH]', 'methylamino', 45.0, None), ('CC(=O)N', 'acetamide', -57.0, None), ('CON=O', 'methyl nitrite', -15.6, None),
 ('CO[N+](=O)[O-]', 'methyl nitrate', -29.0, None), ('NN', 'hydrazine', 22.8, 57.0),
]

def mode_exp():
    out = []
    for smi, name, hf, s in EXP:
        if hf is None: continue
        r = run_kiln([smi])[0]
        r = r[0] if r else {'error': {'message': 'crash'}}
        if r.get('error'):
            out.append((name, smi, hf, 'REFUSED', r['error']['message'][:70], '', '')); continue
        khf = r['hf298_kj_mol'] / 4.184; ks = r['s298_j_mol_k'] / 4.184; u = r['uncertainty_hf298_kj_mol'] / 4.184
        flags = r['missing_groups']
        dh = khf - hf; ds = (ks - s) if s is not None else None
        verdict = 'ok'
        if abs(dh) > 5 and not flags and abs(dh) > 2 * u: verdict = 'CONFIDENT-WRONG-HF'
        elif abs(dh) > 5: verdict = 'off-but-flagged' if flags else 'off-within-2u'
        if ds is not None and abs(ds) > 2.5 and verdict == 'ok': verdict = 'S-off'
        out.append((name, smi, hf, round(khf, 2), round(dh, 2), round(u, 2), (round(ks, 2), s, ds and round(ds, 2)), verdict, flags))
    return out


# ---------------------------------------------------------------- resonance forms of radicals
def resonance_forms(m, limit=12):
    """Kekulé resonance forms of a radical by allylic shifts a•-b=c -> a=b-c• (and a•-b#c -> a=b=c•)."""
    m = Chem.RWMol(m); Chem.Kekulize(m, clearAromaticFlags=True)
    for a in m.GetAtoms():  # freeze hydrogen counts: a shift moves no H
        a.SetNumExplicitHs(a.GetTotalNumHs()); a.SetNoImplicit(True)
    seen = {}; todo = [m]
    while todo and len(seen) < limit:
        x = todo.pop()
        s = Chem.MolToSmiles(x, kekuleSmiles=True)
        if s in seen: continue
        seen[s] = x
        for a in x.GetAtoms():
            if a.GetNumRadicalElectrons() != 1: continue
            for bab in a.GetBonds():
                if bab.GetBondType() != Chem.BondType.SINGLE: continue
                b = bab.GetOtherAtom(a)
                for bbc in b.GetBonds():
                    c = bbc.GetOtherAtom(b)
                    if c.GetIdx() == a.GetIdx() or bbc.GetBondType() not in (Chem.BondType.DOUBLE, Chem.BondType.TRIPLE):
                        continue
                    y = Chem.RWMol(x)
                    y.GetBondBetweenAtoms(a.GetIdx(), b.GetIdx()).SetBondType(Chem.BondType.DOUBLE)
                    y.GetBondBetweenAtoms(b.GetIdx(), c.GetIdx()).SetBondType(
                        Chem.BondType.SINGLE if bbc.GetBondType() == Chem.BondType.DOUBLE else Chem.BondType.DOUBLE)
                    ya, yc = y.GetAtomWithIdx(a.GetIdx()), y.GetAtomWithIdx(c.GetIdx())
                    ya.SetNumRadicalElectrons(0); yc.SetNumRadicalElectrons(yc.GetNumRadicalElectrons() + 1)
                    try:
                        Chem.SanitizeMol(y, Chem.SanitizeFlags.SANITIZE_ALL ^ Chem.SanitizeFlags.SANITIZE_SETAROMATICITY)
                    except Exception:
                        continue
                    todo.append(y)
    return list(seen)

RES_SEED = ['[CH2]C#C', '[CH2]C=CC=C', 'C=C[CH]C', '[CH2]c1ccccc1', '[O]c1ccccc1', '[CH2]C=CC=O', 'C1=CC=C[CH]1',
            '[CH2]C=C', '[CH2]C=O', 'O=C1[CH]CCC1', 'CC#C[CH2]', '[CH2]c1ccc2ccccc2c1', 'C=CC(C)=C[CH2]']

def mode_resonance(n=3000, seed=5):
    rng = random.Random(seed)
    mols = [Chem.MolFromSmiles(s) for s in RES_SEED]
    while len(mols) < n:
        m = rand_mol(rng)
        if m is not None and Descriptors.NumRadicalElectrons(m) == 1 and set(a.GetSymbol() for a in m.GetAtoms()) <= {'C', 'O'}:
            mols.append(m)
    groups = [resonance_forms(m) for m in mols]
    groups = [g for g in groups if len(g) > 1]
    def one(g):
        r = run_kiln(g)[0]
        return g, r
    bad = []; stats = collections.Counter()
    with ThreadPoolExecutor(2) as ex:
        for g, r in ex.map(one, groups):
            stats['molecules with >1 form'] += 1
            vals = [(x['error'] is not None, x['hf298_kj_mol'] and round(x['hf298_kj_mol'] / 4.184, 2),
                     x['s298_j_mol_k'] and round(x['s298_j_mol_k'] / 4.184, 2), x['symmetry_number']) for x in r]
            if len(set(vals)) > 1:
                stats['differ'] += 1
                hf = [v[1] for v in vals if v[1] is not None]
                spread = (max(hf) - min(hf)) if hf else 0
                if spread > 1: stats['differ ΔHf > 1 kcal/mol'] += 1
                bad.append((round(spread, 2), list(zip(g, vals, [x['uncertainty_hf298_kj_mol'] and round(x['uncertainty_hf298_kj_mol'] / 4.184, 2) for x in r]))))
    bad.sort(key=lambda t: -t[0])
    return stats, bad


def parse_args(argv):
    p = argparse.ArgumentParser(
        description='Differential test of `kiln estimate --json` against RDKit (run with /usr/bin/python3; '
                    'see internal/difftest/README.md). Prints JSON (random, fuzz, resonance, order) or lines (sigma, exp).',
        formatter_class=argparse.RawDescriptionHelpFormatter,
        epilog='modes:\n'
               '  random N [SEED [REPO]]  N random molecules: formula, mass, atom accounting, radicals, sanity,\n'
               '                          order and spelling invariance, canonical SMILES, timing (builds an\n'
               '                          in-process helper against REPO, default: this repository)\n'
               '  fuzz N                  mutated SMILES: acceptance by RDKit vs kiln\n'
               '  resonance [N]           radicals and their resonance forms give one answer (default 3000)\n'
               '  order                   one call in two orders vs one call per molecule\n'
               '  sigma                   textbook symmetry numbers over random spellings\n'
               '  exp                     handbook values entered from memory (for spotting confident wrong numbers)\n')
    p.add_argument('mode', choices=['random', 'fuzz', 'resonance', 'order', 'sigma', 'exp'])
    p.add_argument('args', nargs='*', help='the mode\'s arguments (see modes below)')
    p.add_argument('--kiln', default=KILN, metavar='PATH',
                   help='kiln binary (default: $KILN, else /tmp/kiln-tester; now %(default)s)')
    p.add_argument('--aromatic', action='store_true',
                   help='random: also compare the number of aromatic atoms of kiln\'s canonical SMILES with RDKit\'s '
                        '(differences may be aromaticity-model differences, not bugs)')
    a = p.parse_args(argv)
    want = {'random': (1, 3), 'fuzz': (1, 1), 'resonance': (0, 1), 'order': (0, 0), 'sigma': (0, 0), 'exp': (0, 0)}[a.mode]
    if not want[0] <= len(a.args) <= want[1]:
        p.error('%s takes %d to %d argument(s), not %d' % (a.mode, want[0], want[1], len(a.args)))
    return a


if __name__ == '__main__':
    opts = parse_args(sys.argv[1:])
    KILN = opts.kiln
    mode, args = opts.mode, opts.args
    if mode == 'random':
        n = int(args[0]); seed = int(args[1]) if len(args) > 1 else 1
        stats, bad, refusals, slow = mode_random(n, seed, args[2] if len(args) > 2 else REPO, aromatic=opts.aromatic)
        print(json.dumps({'stats': stats, 'problem_counts': {k: len(v) for k, v in bad.items()},
                          'refusal_messages': refusals.most_common(40), 'slow_count': len(slow), 'slow': sorted(slow, reverse=True)[:40],
                          'examples': {k: v[:25] for k, v in bad.items()}}, indent=1, default=str))
    elif mode == 'fuzz':
        out, dis = mode_fuzz(int(args[0]))
        print(json.dumps({'classes': {' / '.join(k): v for k, v in out.items()},
                          'disagreements': {(' / '.join(k) if isinstance(k, tuple) else k): v[:40] for k, v in dis.items()},
                          'disagreement_counts': {(' / '.join(k) if isinstance(k, tuple) else k): len(v) for k, v in dis.items()}}, indent=1, default=str))
    elif mode == 'sigma':
        for r in mode_sigma(): print('%-40s expected %-6s kiln %-30s %s' % r)
    elif mode == 'exp':
        for r in mode_exp(): print(*r, sep=' | ')
    elif mode == 'resonance':
        stats, bad = mode_resonance(int(args[0]) if args else 3000)
        print(json.dumps({'stats': stats, 'worst': bad[:40]}, indent=1, ensure_ascii=False))
    elif mode == 'order':
        n, bad = mode_order()
        print(json.dumps({'spellings': n, 'order_dependent': bad[:40], 'count': len(bad)}, indent=1, default=str))
