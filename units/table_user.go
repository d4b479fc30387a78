package units

import (
	"errors"
	"fmt"
	"slices"
	"sync"
	"sync/atomic"
	"unicode/utf8"
)

// ErrDefine is the Kind of every error Table.Define returns.
var ErrDefine = errors.New("cannot define unit")

// Table is a unit table the caller owns: the built-in units and the
// caller's own definitions, such as a lab's TR for 12000 BTU/h or a rig's
// div for 0.25 inH2O. The built-in table itself cannot be changed. A Table
// is safe for concurrent use; the zero Table is not ready, use NewTable.
type Table struct {
	mu       sync.RWMutex
	defs     map[string]*entry
	names    []string
	cache    sync.Map
	cacheLen atomic.Int64
}

// NewTable returns a table holding the built-in units only.
func NewTable() *Table { return &Table{defs: make(map[string]*entry)} }

func (t *Table) lookup(sym string) (*entry, bool) {
	t.mu.RLock()
	e, ok := t.defs[sym]
	t.mu.RUnlock()
	if ok {
		return e, true
	}
	return lookupIn(builtinIndex, sym)
}

func (t *Table) spellings() []string {
	t.mu.RLock()
	defer t.mu.RUnlock()
	// A new slice: the built-in list is shared by every table and goroutine.
	return slices.Concat(builtinSpellings(), t.names)
}

// Define adds a unit named name, equal to the unit expression expr, which
// may use earlier definitions and numbers: Define("TR", "12000 BTU/h").
// The name must be a single symbol that does not already mean something,
// with or without an SI prefix. User units take no prefixes.
func (t *Table) Define(name, expr string) error {
	if name == "" || len(name) > 32 || !utf8.ValidString(name) {
		return &Error{Op: OpDefine, Kind: ErrDefine, Input: name, Reason: "a name must be 1 to 32 bytes of valid UTF-8", Err: nil}
	}
	for i, r := range name {
		if i == 0 && !isSymbolStart(r) || i > 0 && !isSymbolRune(r) {
			return &Error{Op: OpDefine, Kind: ErrDefine, Input: name, Reason: fmt.Sprintf("%q cannot appear in a unit name (letters, digits and _ only, starting with a letter)", r)}
		}
		if i == 0 && (r == '%' || r == '′' || r == '″') && len(name) > utf8.RuneLen(r) {
			return &Error{Op: OpDefine, Kind: ErrDefine, Input: name, Reason: fmt.Sprintf("%q stands alone as a symbol, so a name starting with it could never be read back", r)}
		}
	}
	u, err := parseWith(t, expr)
	if err != nil {
		return &Error{Op: OpDefine, Kind: ErrDefine, Input: name, Err: err}
	}
	if u.temp == tempScale {
		return &Error{Op: OpDefine, Kind: ErrDefine, Input: name, Reason: "a temperature scale cannot be redefined; define an interval with Δ°C or K"}
	}
	t.mu.Lock()
	defer t.mu.Unlock()
	if _, ok := t.defs[name]; ok {
		return &Error{Op: OpDefine, Kind: ErrDefine, Input: name, Reason: "already defined in this table"}
	}
	if e, ok := lookupIn(builtinIndex, name); ok && e.ambiguous == "" {
		return &Error{Op: OpDefine, Kind: ErrDefine, Input: name, Reason: "already a built-in unit (or a prefixed one)"}
	}
	u = symbolUnit(u, name)
	if u.temp != tempInterval {
		u.temp = tempNone // a difference stays a difference; anything else has no role
	}
	t.defs[name] = &entry{u: u, sym: name, uni: name, tex: `\mathrm{` + name + `}`}
	t.names = append(t.names, name)
	return nil
}

// Parse reads a unit expression with this table; see the package-level
// Parse for the grammar.
func (t *Table) Parse(expr string) (Unit, error) {
	if u, ok := t.cache.Load(expr); ok {
		return u.(Unit), nil
	}
	u, err := parseWith(t, expr)
	if err != nil {
		return Unit{}, err
	}
	if t.cacheLen.Load() < maxCacheLen {
		if _, loaded := t.cache.LoadOrStore(expr, u); !loaded {
			t.cacheLen.Add(1)
		}
	}
	return u, nil
}

// ParseValue reads a number and a unit with this table.
func (t *Table) ParseValue(s string) (Value, error) { return parseValue(t, s, t.Parse) }

// Convert converts v between two unit expressions of this table.
func (t *Table) Convert(v float64, from, to string) (float64, error) {
	fu, err := t.Parse(from)
	if err != nil {
		return 0, err
	}
	tu, err := t.Parse(to)
	if err != nil {
		return 0, err
	}
	return ConvertUnits(v, fu, tu)
}
