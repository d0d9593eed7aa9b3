import json, sys, collections
# Prints the inclusive call tree under a frame of a dotnet-trace Speedscope file (docs/performance.md).
# usage: python3 bench/calltree.py trace.speedscope.json "FRAME SUBSTRING" [depth] [min_ms]
# Times are thread time summed over every thread that ran the frame, in seconds.
d = json.load(open(sys.argv[1]))
frames = [f['name'] for f in d['shared']['frames']]
root = sys.argv[2]; depth = int(sys.argv[3]) if len(sys.argv) > 3 else 6; minms = float(sys.argv[4]) if len(sys.argv) > 4 else 200
tree = collections.defaultdict(float)  # path under root -> ms
for p in d['profiles']:
    stack = []  # (frame, at)
    rootpos = None
    for e in p['events']:
        if e['type'] == 'O':
            stack.append((e['frame'], e['at']))
            if rootpos is None and root in frames[e['frame']]:
                rootpos = len(stack) - 1
        else:
            f, at = stack.pop()
            if rootpos is not None and len(stack) >= rootpos:
                path = tuple(x[0] for x in stack[rootpos:]) + (f,)
                if len(path) <= depth:
                    tree[path] += e['at'] - at
                if len(stack) == rootpos:
                    rootpos = None
def show(prefix, level):
    kids = [(v, k) for k, v in tree.items() if len(k) == len(prefix) + 1 and k[:len(prefix)] == prefix]
    kids.sort(reverse=True)
    for v, k in kids:
        if v < minms: continue
        print('  ' * level + f'{v/1000:8.2f}s  ' + frames[k[-1]][:150])
        show(k, level + 1)
show((), 0)
