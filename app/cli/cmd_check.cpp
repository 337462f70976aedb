#include <iostream>

#include "cli/commands.h"

namespace gramline::cli {

int run_check(const CheckRequest& request) {
  (void)request;
  std::cerr << "gramline-cli check: margin check not built yet\n";
  return 1;
}

}  // namespace gramline::cli
