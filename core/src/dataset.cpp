#include "gramline/dataset.h"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <numeric>
#include <sstream>

namespace gramline {

Eigen::VectorXd DataSet::point(int global_index) const {
  if (global_index < train_count()) return train.row(global_index).transpose();
  return test.row(global_index - train_count()).transpose();
}

namespace {

std::string folded_name(const std::string& name) {
  size_t begin = 0;
  size_t end = name.size();
  auto blank = [](char c) { return c == ' ' || c == '\t'; };
  while (begin < end && blank(name[begin])) ++begin;
  while (end > begin && blank(name[end - 1])) --end;
  std::string out = name.substr(begin, end - begin);
  std::transform(out.begin(), out.end(), out.begin(),
                 [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return out;
}

}  // namespace

std::string feature_name_problem(const std::string& name) {
  for (unsigned char c : name) {
    if (c < 0x20 || c == 0x7f) return "a feature name may not hold control characters";
  }
  const std::string key = folded_name(name);
  if (key.empty()) return "a feature name may not be blank";
  if (key == "label" || key == "set") {
    return "'" + key +
           "' is reserved for the class and set columns of the data CSV; rename the feature";
  }
  return {};
}

std::string validate(const DataSet& data) {
  std::ostringstream err;
  if (data.train_count() == 0) return "data set: no training points";
  if (data.feature_count() == 0) return "data set: no features";
  if (data.test_count() > 0 && data.test.cols() != data.train.cols()) {
    err << "data set: test points have " << data.test.cols() << " features, training points "
        << data.train.cols();
    return err.str();
  }
  if (data.train_labels.size() != data.train.rows() || data.test_labels.size() != data.test.rows())
    return "data set: label count differs from point count";
  if (!data.feature_names.empty() &&
      static_cast<int>(data.feature_names.size()) != data.feature_count())
    return "data set: feature name count differs from feature count";
  for (size_t f = 0; f < data.feature_names.size(); ++f) {
    if (auto e = feature_name_problem(data.feature_names[f]); !e.empty())
      return "feature " + std::to_string(f) + " name: " + e;
    for (size_t g = 0; g < f; ++g) {
      if (folded_name(data.feature_names[g]) == folded_name(data.feature_names[f]))
        return "feature " + std::to_string(f) + " name: '" + data.feature_names[f] +
               "' is the name of feature " + std::to_string(g) + " (names ignore case)";
    }
  }
  auto check_block = [&](const Eigen::MatrixXd& x, const Eigen::VectorXi& y, int offset,
                         const char* what) -> std::string {
    for (int i = 0; i < x.rows(); ++i) {
      if (y(i) != 1 && y(i) != -1) {
        std::ostringstream e;
        e << what << " point " << i + offset << ": label " << y(i) << " is not -1 or +1";
        return e.str();
      }
      for (int f = 0; f < x.cols(); ++f) {
        if (!std::isfinite(x(i, f))) {
          std::ostringstream e;
          e << what << " point " << i + offset << ", feature " << f;
          if (f < static_cast<int>(data.feature_names.size()))
            e << " (" << data.feature_names[f] << ")";
          e << ": not a finite number";
          return e.str();
        }
      }
    }
    return {};
  };
  if (auto e = check_block(data.train, data.train_labels, 0, "training"); !e.empty()) return e;
  if (auto e = check_block(data.test, data.test_labels, data.train_count(), "test"); !e.empty())
    return e;
  const bool has_pos = (data.train_labels.array() == 1).any();
  const bool has_neg = (data.train_labels.array() == -1).any();
  if (!has_pos || !has_neg) return "training points: only one class present";
  // Duplicate training points make the Gram matrix singular and the pair order ambiguous.
  std::vector<int> order(data.train_count());
  std::iota(order.begin(), order.end(), 0);
  auto row_less = [&](int a, int b) {
    for (int f = 0; f < data.feature_count(); ++f) {
      if (data.train(a, f) != data.train(b, f)) return data.train(a, f) < data.train(b, f);
    }
    return a < b;
  };
  std::sort(order.begin(), order.end(), row_less);
  for (size_t k = 1; k < order.size(); ++k) {
    if (data.train.row(order[k]) == data.train.row(order[k - 1])) {
      std::ostringstream e;
      e << "training points " << std::min(order[k], order[k - 1]) << " and "
        << std::max(order[k], order[k - 1]) << " are duplicates";
      return e.str();
    }
  }
  return {};
}

}  // namespace gramline
