package formula

import (
	"strconv"
	"strings"
)

// Text writes the program back as formula text in a canonical form: one
// statement per line, operators spaced, parentheses only where needed,
// numbers in SI with the shortest decimal that reads back to the same
// float64, exact exponents as written. Compiling the text gives the same
// program.
func (p *Program) Text() string {
	var sb strings.Builder
	for i, st := range p.stmts {
		if i > 0 {
			sb.WriteByte('\n')
		}
		if st.name != "" {
			sb.WriteString(st.name)
			sb.WriteString(" = ")
		}
		writeNode(&sb, st.e, 0)
	}
	return sb.String()
}

// precedence of each kind, higher binds tighter.
func prec(k kind) int {
	switch k {
	case kOr:
		return 1
	case kAnd:
		return 2
	case kCmp:
		return 3
	case kAdd, kSub:
		return 4
	case kMul, kDiv:
		return 5
	case kNeg:
		return 6
	case kPow, kPowX:
		return 7
	}
	return 8
}

func writeNode(sb *strings.Builder, n *node, outer int) {
	p := prec(n.k)
	paren := p < outer
	if paren {
		sb.WriteByte('(')
	}
	switch n.k {
	case kNum:
		sb.WriteString(strconv.FormatFloat(n.val, 'g', -1, 64))
		if !n.dim.IsDimensionless() {
			sb.WriteString(" {")
			sb.WriteString(n.dim.SIUnitASCII())
			sb.WriteByte('}')
		}
	case kRef:
		sb.WriteString(n.name)
	case kNeg:
		sb.WriteByte('-')
		writeNode(sb, n.args[0], p+1)
	case kAdd, kSub, kMul, kDiv, kCmp, kAnd, kOr:
		writeNode(sb, n.args[0], p)
		sb.WriteString(map[kind]string{kAdd: " + ", kSub: " - ", kMul: " * ", kDiv: " / ", kAnd: " and ", kOr: " or "}[n.k])
		if n.k == kCmp {
			sb.WriteString(" " + n.name + " ")
		}
		// The right operand of a non-commutative operator, and any of a
		// comparison, binds tighter.
		writeNode(sb, n.args[1], p+1)
	case kPow:
		writeNode(sb, n.args[0], p+1)
		sb.WriteString("^(")
		if n.exp.IsInt() || float64(n.exp.Num())/float64(n.exp.Den()) != n.expF {
			// A decimal written: its shortest float text reads back the same.
			sb.WriteString(strconv.FormatFloat(n.expF, 'g', -1, 64))
		} else {
			sb.WriteString(n.exp.String())
		}
		sb.WriteByte(')')
	case kPowX:
		writeNode(sb, n.args[0], p+1)
		sb.WriteString("^(")
		writeNode(sb, n.args[1], 0)
		sb.WriteByte(')')
	case kSolve:
		sb.WriteString("solve(")
		sb.WriteString(n.name)
		sb.WriteString(", ")
		writeNode(sb, n.args[0], 0)
		if len(n.args) == 4 {
			sb.WriteString(" = ")
			writeNode(sb, n.args[1], 0)
		}
		for _, a := range n.args[len(n.args)-2:] {
			sb.WriteString(", ")
			writeNode(sb, a, 0)
		}
		sb.WriteByte(')')
	case kCall:
		sb.WriteString(n.name)
		sb.WriteByte('(')
		for i, a := range n.args {
			if i > 0 {
				sb.WriteString(", ")
			}
			writeNode(sb, a, 0)
		}
		sb.WriteByte(')')
	}
	if paren {
		sb.WriteByte(')')
	}
}
