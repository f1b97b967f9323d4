package dist

import (
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"strings"
)

// The page's scripts are ES modules (web/static/main.js and what it
// imports). A page opened from a file cannot import other files, so the
// single file carries them joined into one inline module by Bundle. The
// modules keep to a plain subset that makes joining exact:
//
//   - imports are `import { a, b } from './x.js';` or `import './x.js';`
//     on one line, naming files beside them (no renaming with "as", no
//     default, no namespace, no dynamic import);
//   - exports are `export` in front of a top-level function, const, let
//     or class (no `export {...}`, no default);
//   - no two modules declare the same top-level name (Bundle checks the
//     names it can see; the browser rejects any other clash, since the
//     joined script is itself a module).
//
// Joined in the order a browser runs them (each module after the modules
// it imports, depth first, in the order of its imports), with the imports
// and the word export taken out, the modules behave as they do apart:
// their top-level code runs in the same order, and a name refers to the
// same declaration.

var (
	importNamed = regexp.MustCompile(`^import \{([^}]*)\} from '\./([a-z0-9-]+\.js)';\s*$`)
	importBare  = regexp.MustCompile(`^import '\./([a-z0-9-]+\.js)';\s*$`)
	exportDecl  = regexp.MustCompile(`^export ((?:async )?function\*? |const |let |class )`)
	topName     = regexp.MustCompile(`^(?:async )?(?:function\*? |class |const |let |var )([A-Za-z_$][\w$]*)`)
)

// Bundle joins the module entry in dir (for example "main.js") and every
// module it imports into one module script.
func Bundle(dir, entry string) (string, error) {
	var out strings.Builder
	state := map[string]int{} // 1: being visited, 2: written
	declared := map[string]string{}
	var visit func(name string) error
	visit = func(name string) error {
		if state[name] != 0 {
			return nil // written, or an import cycle: ES modules run it once, first come
		}
		state[name] = 1
		src, err := os.ReadFile(filepath.Join(dir, name))
		if err != nil {
			return err
		}
		var body []string
		for i, line := range strings.Split(string(src), "\n") {
			where := fmt.Sprintf("%s:%d", name, i+1)
			if m := importNamed.FindStringSubmatch(line); m != nil {
				if strings.Contains(m[1], " as ") {
					return fmt.Errorf("%s: an import renames a name (\"as\"): not joinable", where)
				}
				if err := visit(m[2]); err != nil {
					return err
				}
				continue
			}
			if m := importBare.FindStringSubmatch(line); m != nil {
				if err := visit(m[1]); err != nil {
					return err
				}
				continue
			}
			if strings.HasPrefix(line, "import") || strings.Contains(line, "import(") {
				return fmt.Errorf("%s: an import Bundle cannot join: %q", where, line)
			}
			if strings.HasPrefix(line, "export") {
				if !exportDecl.MatchString(line) {
					return fmt.Errorf("%s: an export Bundle cannot join: %q", where, line)
				}
				line = strings.TrimPrefix(line, "export ")
			}
			for _, n := range topNames(line) {
				if other, ok := declared[n]; ok {
					return fmt.Errorf("%s: %s is declared in %s too", where, n, other)
				}
				declared[n] = name
			}
			body = append(body, line)
		}
		state[name] = 2
		out.WriteString("// " + name + "\n" + strings.TrimRight(strings.Join(body, "\n"), "\n") + "\n")
		return nil
	}
	if err := visit(entry); err != nil {
		return "", err
	}
	return out.String(), nil
}

// topNames gives the names a top-level line declares: a function's or
// class's name, or every name of a `let`, `const` or `var` list on the
// line (`let a = 1, b = {}, c;`: the names before each comma at bracket
// depth 0).
func topNames(line string) []string {
	m := topName.FindStringSubmatch(line)
	if m == nil {
		return nil
	}
	names := []string{m[1]}
	rest, ok := strings.CutPrefix(line, "const ")
	if !ok {
		if rest, ok = strings.CutPrefix(line, "let "); !ok {
			if rest, ok = strings.CutPrefix(line, "var "); !ok {
				return names
			}
		}
	}
	depth, quote := 0, rune(0)
	for i, r := range rest {
		switch {
		case quote != 0:
			if r == quote {
				quote = 0
			}
		case r == '\'' || r == '"' || r == '`':
			quote = r
		case r == '(' || r == '[' || r == '{':
			depth++
		case r == ')' || r == ']' || r == '}':
			depth--
		case r == ';' && depth == 0:
			return names
		case r == ',' && depth == 0:
			if n := leadingName.FindStringSubmatch(rest[i+1:]); n != nil {
				names = append(names, n[1])
			}
		}
	}
	return names
}

var leadingName = regexp.MustCompile(`^\s*([A-Za-z_$][\w$]*)\s*(?:=|,|;|$)`)
