import json,sys,subprocess,math
R=1.987204;k=1.380649e-23;h=6.62607015e-34;NA=6.02214076e23;T=298.15;P=1e5
def strans(M):
    m=M/1000/NA
    return R*(math.log(k*T/P*(2*math.pi*m*k*T/h**2)**1.5)+2.5)
smis=sys.argv[1:]
out=subprocess.run([__import__('os').environ.get('KILN','kiln'),'estimate','--json']+smis,capture_output=True,text=True).stdout
for d in json.loads(out):
    if d.get('error'): print(d['input'],'ERR',d['error']['message'][:80]); continue
    S=d['s298_j_mol_k']/4.184; st=strans(d['molar_mass_g_mol'])
    cp=d['cp_j_mol_k']; c3=cp['300']/4.184; c4=cp['400']/4.184
    flag='  <-- S below S_trans+8' if S<st+8 else ''
    print(f"{d['input']:40s} S={S:6.2f} Strans={st:5.2f} S-Strans={S-st:6.2f} Cp300={c3:6.2f} Cp400={c4:6.2f} u={d['uncertainty_hf298_kj_mol']/4.184:.2f} miss={len(d.get('missing_groups') or [])}{flag}")
