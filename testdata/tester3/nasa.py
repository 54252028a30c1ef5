import sys,re,math
R=1.987204258640832e-3 # kcal/mol/K
txt=open(sys.argv[1]).read().splitlines()
cur=None;blocks={}
for l in txt:
    if l.startswith('species '):
        cur=l.split()[1]
    m=re.match(r'\s+nasa7\s+(\S+)\s+(\S+)\s+(\S+)',l)
    if m: blocks[cur]={'T':list(map(float,m.groups()))}
    m=re.match(r'\s+(low|high)\s+(.*)',l)
    if m and cur in blocks: blocks[cur][m.group(1)]=list(map(float,m.group(2).split()[:7]))
def ev(b,T):
    a=b['low'] if T<=b['T'][1] else b['high']
    cp=sum(a[i]*T**i for i in range(5))
    h=(a[0]+a[1]*T/2+a[2]*T**2/3+a[3]*T**3/4+a[4]*T**4/5+a[5]/T)*T
    s=a[0]*math.log(T)+a[1]*T+a[2]*T**2/2+a[3]*T**3/3+a[4]*T**4/4+a[6]
    return cp*R*1000,h*R,s*R*1000
for n,b in blocks.items():
    cp,h,s=ev(b,298.15)
    print(f"{n:10s} Hf={h:8.2f} S={s:7.2f} Cp300={ev(b,300)[0]:6.2f} Cp1000={ev(b,1000)[0]:6.2f} Cp1500={ev(b,1500)[0]:6.2f} Tmid-gap cp={ev(b,b['T'][1]-1e-9)[0]-ev(b,b['T'][1]+1e-9)[0]:.2e}")
