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
			if m := topName.FindStringSubmatch(line); m != nil {
				if other, ok := declared[m[1]]; ok {
					return fmt.Errorf("%s: %s is declared in %s too", where, m[1], other)
				}
				declared[m[1]] = name
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
