if (!Object.groupBy) { Object.groupBy = (items, fn) => { const out = Object.create(null); let i = 0; for (const it of items) { const k = fn(it, i++); (out[k] ||= []).push(it); } return out; }; }
