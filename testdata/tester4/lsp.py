import json, subprocess, sys, threading, queue, time, os
class Client:
    def __init__(self, cmd=[__import__('os').environ.get('KILN','/tmp/kiln-t4'),'serve'], caps=None):
        self.p = subprocess.Popen(cmd, stdin=subprocess.PIPE, stdout=subprocess.PIPE, stderr=open('/tmp/kiln_lsp_stderr_t4.txt','a'))
        self.id = 0; self.q = queue.Queue(); self.resp = {}; self.notes = []
        self.cv = threading.Condition()
        threading.Thread(target=self._read, daemon=True).start()
        r = self.req('initialize', {'processId': os.getpid(), 'rootUri': os.environ.get('ROOT','file:///tmp/t4'), 'capabilities': caps or {'textDocument': {'hover': {'contentFormat': ['markdown','plaintext']}, 'publishDiagnostics': {}}}, 'workspaceFolders': None})
        self.init = r
        self.notify('initialized', {})
    def _read(self):
        f = self.p.stdout
        while True:
            hdr = {}
            while True:
                line = f.readline()
                if not line: return
                line = line.decode().strip()
                if not line: break
                k, v = line.split(':', 1); hdr[k.lower()] = v.strip()
            body = json.loads(f.read(int(hdr['content-length'])))
            with self.cv:
                if 'id' in body and 'method' not in body:
                    self.resp[body['id']] = body
                elif 'method' in body and 'id' in body:
                    # server request: reply null
                    self.send({'jsonrpc':'2.0','id':body['id'],'result':None})
                    self.notes.append(body)
                else:
                    self.notes.append(body)
                self.cv.notify_all()
    def send(self, msg):
        b = json.dumps(msg).encode()
        self.p.stdin.write(b'Content-Length: %d\r\n\r\n' % len(b) + b); self.p.stdin.flush()
    def req(self, method, params, timeout=30):
        self.id += 1; i = self.id
        self.send({'jsonrpc':'2.0','id':i,'method':method,'params':params})
        with self.cv:
            self.cv.wait_for(lambda: i in self.resp, timeout)
        r = self.resp.get(i)
        if r is None: raise TimeoutError(method)
        return r
    def notify(self, method, params):
        self.send({'jsonrpc':'2.0','method':method,'params':params})
    def diags(self, uri, timeout=10, after=0):
        end = time.time()+timeout
        with self.cv:
            while True:
                ds = [n for n in self.notes[after:] if n.get('method')=='textDocument/publishDiagnostics' and n['params']['uri']==uri]
                if ds: return ds[-1]['params']['diagnostics']
                rem = end-time.time()
                if rem <= 0: return None
                self.cv.wait(rem)
